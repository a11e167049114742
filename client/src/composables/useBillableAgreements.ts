// The beekeeper's signed agreements with delivered colonies and no invoice yet (useAsync's
// data, loading, error and run), loaded at once.
import { invoicesApi } from '@/api/invoices';
import { useAsync } from './useAsync';

export function useBillableAgreements() {
  return useAsync(async () => (await invoicesApi.billableAgreements()).agreements);
}
