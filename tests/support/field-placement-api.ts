// A scheduled placement reached the way the two sides reach one through the API: the grower
// lists a request, the beekeeper commits, both confirm; the agreement is then dated
// `agreedAt`, so a phone's record from before now is not before the agreement.
import type { ApiClient } from './api-client.js';
import { agreementMadeAt, requestPayload, type buildMarket } from './builders/requests.js';

type Market = Awaited<ReturnType<typeof buildMarket>>;

export async function scheduledPlacementThroughApi(
  clients: { grower: ApiClient; keeper: ApiClient; crew: ApiClient }, m: Market, colonies: number, agreedAt: Date,
): Promise<string> {
  const { grower, keeper, crew } = clients;
  const r = (await grower.post('/api/requests', requestPayload(m.block.id, {}, m)).expect(201)).body.request;
  await grower.post(`/api/requests/${r.id}/publish`).expect(200);
  const c = (await keeper.post(`/api/requests/${r.id}/commitments`, { colonies }).expect(201)).body.commitment;
  await grower.post(`/api/agreements/${c.agreementId}/confirm`).expect(200);
  await keeper.post(`/api/agreements/${c.agreementId}/confirm`).expect(200);
  await agreementMadeAt({ id: c.agreementId }, agreedAt);
  return (await crew.get(`/api/placements?agreementId=${c.agreementId}`).expect(200)).body.placements[0].id;
}
