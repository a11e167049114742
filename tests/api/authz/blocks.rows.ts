// Authorization rows for /api/blocks, /api/weather and /api/bloom: every farm member reads
// the farm's blocks, stations and forecasts; owners and managers change them; another
// farm's owner gets 404 for this farm's rows; beekeepers see only the bloom windows of
// blocks they follow; the platform admin edits the published reference data.
import { buildBlock } from '../../support/builders/season.js';
import { buildStation } from '../../support/builders/weather.js';
import { QueryTypes } from 'sequelize';
import { apiaryMembers, each, farmMembers, statuses, type AuthzRow, type AuthzWorld } from './authz-row.js';
import { builderSequelize } from '../../support/builders/builder-database.js';

interface Fixtures { blockId: string; stationId: string; frostId: string }

let n = 0;
/** A new lower-case stage key each time (stage keys are letters and dashes only). */
const letters = () => {
  let k = n++;
  let key = '';
  do { key = String.fromCharCode(97 + (k % 26)) + key; k = Math.floor(k / 26); } while (k > 0);
  return `${key}-${Date.now().toString(36).replace(/[0-9]/g, '')}`;
};
const unique = () => `${Date.now().toString(36)}-${n++}`;

/** Farm owners and managers may; farm applicators, viewers, beekeepers and the admin may not; another farm gets 404. */
const farmEditors = (status: number) => statuses(403, { 'farm:owner': status, 'farm:manager': status, 'other-farm': 404 });
const farmReaders = (status: number) => statuses(403, { ...each(farmMembers, status), 'other-farm': 404 });

const newBlock = async ({ world }: { world: AuthzWorld }) => ({ id: (await buildBlock({ farm: world.own.farm, name: `Removable ${unique()}` })).id });

export const setup = async (world: AuthzWorld): Promise<Fixtures> => {
  const station = await buildStation({ farm: world.own.farm, name: 'Authz mast' });
  const block = await buildBlock({ farm: world.own.farm, name: 'Authz block' });
  const [frost] = await builderSequelize().query<{ id: string }>("SELECT id FROM frost_critical_temperatures WHERE crop = 'apple' ORDER BY sort_order LIMIT 1", { type: QueryTypes.SELECT });
  return { blockId: block.id, stationId: station.id, frostId: frost.id };
};

export const rows: AuthzRow<Fixtures>[] = [
  { title: 'list the farm\'s blocks', method: 'GET', path: '/api/blocks', policy: { table: 'blocks', action: 'list' }, expect: statuses(403, { ...each(farmMembers, 200), 'other-farm': 200 }) },
  {
    title: 'add a block', method: 'POST', path: '/api/blocks', body: ({ caller }) => ({ name: `New block ${caller} ${unique()}`, crop: 'apple', enteredAcres: 4 }),
    policy: { table: 'blocks', action: 'create' }, expect: statuses(403, { 'farm:owner': 201, 'farm:manager': 201, 'other-farm': 201 }),
  },
  { title: 'open a block', method: 'GET', path: ({ fixtures }) => `/api/blocks/${fixtures.blockId}`, policy: { table: 'blocks', action: 'read' }, expect: farmReaders(200) },
  { title: 'list a block\'s bloom window revisions', method: 'GET', path: ({ fixtures }) => `/api/blocks/${fixtures.blockId}/bloom-windows`, policy: { table: 'blocks', action: 'read' }, expect: farmReaders(200) },
  { title: 'change a block', method: 'PATCH', path: ({ fixtures }) => `/api/blocks/${fixtures.blockId}`, body: { notes: 'Checked the drip lines' }, policy: { table: 'blocks', action: 'update' }, expect: farmEditors(200) },
  { title: 'remove a block', method: 'DELETE', path: ({ fresh }) => `/api/blocks/${fresh.id}`, fresh: newBlock, policy: { table: 'blocks', action: 'delete' }, expect: farmEditors(204) },
  { title: 'open a block\'s bloom forecast', method: 'GET', path: ({ fixtures }) => `/api/blocks/${fixtures.blockId}/forecast`, policy: { table: 'blocks', action: 'forecast' }, expect: farmReaders(200) },
  {
    title: 'publish a bloom window', method: 'POST', path: ({ fixtures }) => `/api/blocks/${fixtures.blockId}/bloom-windows`, body: { bloomStart: '2027-04-10', petalFall: '2027-04-24' },
    policy: { table: 'blocks', action: 'publishBloom' }, expect: farmEditors(201),
  },
  { title: 'list weather stations', method: 'GET', path: '/api/weather/stations', policy: { table: 'weather', action: 'list' }, expect: statuses(403, { ...each(farmMembers, 200), 'other-farm': 200 }) },
  {
    title: 'add a weather station', method: 'POST', path: '/api/weather/stations',
    body: ({ caller }) => ({ name: `Mast ${caller} ${unique()}`, location: { type: 'Point', coordinates: [-119.9, 44.9] }, timeZone: 'America/Los_Angeles' }),
    policy: { table: 'weather', action: 'create' }, expect: statuses(403, { 'farm:owner': 201, 'farm:manager': 201, 'other-farm': 201 }),
  },
  { title: 'open a weather station', method: 'GET', path: ({ fixtures }) => `/api/weather/stations/${fixtures.stationId}`, policy: { table: 'weather', action: 'read' }, expect: farmReaders(200) },
  { title: 'read a station\'s chill units', method: 'GET', path: ({ fixtures }) => `/api/weather/stations/${fixtures.stationId}/chill`, policy: { table: 'weather', action: 'read' }, expect: farmReaders(200) },
  { title: 'change a weather station', method: 'PATCH', path: ({ fixtures }) => `/api/weather/stations/${fixtures.stationId}`, body: { timeZone: 'America/Los_Angeles' }, policy: { table: 'weather', action: 'update' }, expect: farmEditors(200) },
  {
    title: 'enter a day\'s temperatures', method: 'PUT', path: ({ fixtures }) => `/api/weather/stations/${fixtures.stationId}/temperatures/2027-03-01`, body: { tmin: 2, tmax: 14, unit: 'C' },
    policy: { table: 'weather', action: 'enterTemperatures' }, expect: farmEditors(200),
  },
  {
    // Sent without a file: allowed callers reach the file check (400), another farm does not find the station.
    title: 'upload temperatures', method: 'POST', path: ({ fixtures }) => `/api/weather/stations/${fixtures.stationId}/temperatures/upload`,
    policy: { table: 'weather', action: 'uploadTemperatures' }, expect: farmEditors(400),
  },
  {
    title: 'enter a forecast low', method: 'PUT', path: ({ fixtures }) => `/api/weather/stations/${fixtures.stationId}/forecast-lows/2027-03-02`, body: { low: -1, unit: 'C' },
    policy: { table: 'weather', action: 'enterForecastLows' }, expect: farmEditors(200),
  },
  {
    title: 'read stage thresholds', method: 'GET', path: '/api/bloom/stage-thresholds', policy: { table: 'bloom', action: 'readReference' },
    expect: statuses(403, { ...each(farmMembers, 200), admin: 200, 'other-farm': 200 }),
  },
  {
    title: 'add own stage thresholds', method: 'POST', path: '/api/bloom/stage-thresholds',
    body: () => ({ crop: 'pear', stage: `stage-${letters()}`, label: 'Own stage', baseF: 43, ddLowF: 100, ddHighF: 150, source: 'Own observation' }),
    policy: { table: 'bloom', action: 'editFarmThresholds' }, expect: statuses(403, { 'farm:owner': 201, 'farm:manager': 201, admin: 201, 'other-farm': 201 }),
  },
  {
    title: 'change a published frost critical temperature', method: 'PATCH', path: ({ fixtures }) => `/api/bloom/frost-critical/${fixtures.frostId}`, body: { kill10F: 15 },
    policy: { table: 'bloom', action: 'editPublishedReference' }, expect: statuses(403, { admin: 200 }),
  },
  {
    title: 'list the bloom windows of followed blocks', method: 'GET', path: '/api/bloom/held-windows', policy: { table: 'bloom', action: 'heldWindows' },
    expect: statuses(403, { ...each(apiaryMembers, 200), 'other-apiary': 200 }),
  },
];
