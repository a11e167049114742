// The map's base layer as the server configures it (tile URL and attribution), asked once
// per page load; an empty URL, or no answer, leaves maps on their plain ground.
import { metaApi } from '@/api/meta';
import { useAsync } from './useAsync';

export function useMapTiles() {
  return useAsync(() => metaApi.get());
}
