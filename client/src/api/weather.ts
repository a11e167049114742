// Weather station calls: stations, daily temperatures (hand entry and CSV upload with
// progress), forecast lows and chill units.
import { http, ApiError } from './http';
import { clientConfig } from '@/config';
import type { ErrorBody } from '@shared/errors';
import type {
  ChillDto, DailyTemperatureBody, DailyTemperatureDto, ForecastLowBody, ForecastLowDto, StationBody, StationDto, TemperatureUnit, UploadResult,
} from '@shared/schemas/weather';

function csrfToken(): Promise<string> {
  return http.get<{ csrfToken: string }>('/auth/csrf').then((r) => r.csrfToken);
}

export const weatherApi = {
  stations: () => http.get<{ stations: StationDto[] }>('/weather/stations'),
  station: (id: string) => http.get<{ station: StationDto }>(`/weather/stations/${id}`),
  createStation: (body: StationBody) => http.post<{ station: StationDto }>('/weather/stations', body),
  updateStation: (id: string, body: Partial<StationBody>) => http.patch<{ station: StationDto }>(`/weather/stations/${id}`, body),
  temperatures: (id: string) => http.get<{ temperatures: DailyTemperatureDto[] }>(`/weather/stations/${id}/temperatures`),
  enterDay: (id: string, day: string, body: DailyTemperatureBody) => http.put<{ temperature: DailyTemperatureDto }>(`/weather/stations/${id}/temperatures/${day}`, body),
  forecastLows: (id: string) => http.get<{ forecastLows: ForecastLowDto[] }>(`/weather/stations/${id}/forecast-lows`),
  enterForecastLow: (id: string, day: string, body: ForecastLowBody) => http.put<{ forecastLow: ForecastLowDto }>(`/weather/stations/${id}/forecast-lows/${day}`, body),
  chill: (id: string) => http.get<{ chill: ChillDto }>(`/weather/stations/${id}/chill`),

  /**
   * Uploads a CSV of daily temperatures (or forecast lows), reporting progress (0–100). fetch cannot report
   * upload progress, so this one call uses XMLHttpRequest; errors become ApiError as in http.ts.
   */
  async upload(
    id: string, file: File, options: { unit: TemperatureUnit; skipBadLines: boolean }, onProgress: (percent: number) => void,
    kind: 'temperatures' | 'forecast-lows' = 'temperatures',
  ): Promise<UploadResult> {
    const token = await csrfToken();
    const form = new FormData();
    form.append('unit', options.unit);
    form.append('skipBadLines', String(options.skipBadLines));
    form.append('file', file);
    return new Promise((resolve, reject) => {
      const xhr = new XMLHttpRequest();
      xhr.open('POST', `${clientConfig.apiBase}/weather/stations/${id}/${kind}/upload`);
      xhr.setRequestHeader('X-CSRF-Token', token);
      xhr.setRequestHeader('Accept', 'application/json');
      xhr.upload.onprogress = (e) => { if (e.lengthComputable) onProgress(Math.round((e.loaded / e.total) * 100)); };
      xhr.onerror = () => reject(new ApiError(0, 'unavailable', 'The upload could not reach the server.'));
      xhr.onload = () => {
        onProgress(100);
        const body = xhr.responseText ? JSON.parse(xhr.responseText) : {};
        if (xhr.status >= 200 && xhr.status < 300) return resolve((body as { result: UploadResult }).result);
        const error = (body as ErrorBody).error ?? { code: 'internal', message: xhr.statusText };
        reject(new ApiError(xhr.status, error.code, error.message, error.fields ?? {}));
      };
      xhr.send(form);
    });
  },
};
