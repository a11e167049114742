// Uploading a station's CSV of daily temperatures or forecast lows (useSubmit's saving,
// error and submit), with the upload's progress in percent and the server's refusals split
// into the bad lines of the file (`lines.<n>.<column>`) and the form's own fields.
import { computed, ref } from 'vue';
import { weatherApi } from '@/api/weather';
import { useSubmit } from './useSubmit';
import type { TemperatureUnit } from '@shared/schemas/weather';

export interface UploadLineError { line: number; field: string; message: string }

export function useUploadTemperatures(stationId: () => string, kind: () => 'temperatures' | 'forecast-lows') {
  const progress = ref<number | null>(null);
  const upload = useSubmit(async (file: File, options: { unit: TemperatureUnit; skipBadLines: boolean }) => {
    progress.value = 0;
    try {
      return await weatherApi.upload(stationId(), file, options, (percent) => (progress.value = percent), kind());
    } finally {
      progress.value = null;
    }
  });
  const lineErrors = computed<UploadLineError[]>(() =>
    Object.entries(upload.fieldErrors.value)
      .flatMap(([key, message]) => {
        const match = /^lines\.(\d+)\.(\w+)$/.exec(key);
        return match ? [{ line: Number(match[1]), field: match[2], message }] : [];
      })
      .sort((a, b) => a.line - b.line),
  );
  const fieldErrors = computed(() => Object.fromEntries(Object.entries(upload.fieldErrors.value).filter(([key]) => !key.startsWith('lines.'))));

  /** Forgets the last refusal (a new file was chosen). */
  function clear() {
    upload.error.value = null;
    upload.fieldErrors.value = {};
  }

  return { saving: upload.saving, error: upload.error, fieldErrors, lineErrors, progress, submit: upload.submit, clear };
}
