// The organization's weather stations, loaded when asked for (useAsync's data, loading,
// error and run), e.g. to choose the station a block's bloom forecast reads.
import { weatherApi } from '@/api/weather';
import { useAsync } from './useAsync';

export function useWeatherStations() {
  return useAsync(async () => (await weatherApi.stations()).stations);
}
