// The conflict check of one spray: runs the database search, groups what it found by
// apiary business and grades each group with the shared rules. The dry run and the
// stored alerts use this same function; the search is one statement, on the caller's
// transaction's connection when there is one.
import type { Sequelize, Transaction } from 'sequelize';
import { productBeeHazard } from '../../../../shared/domain/bee-toxicity.js';
import { gradeConflict, compareGrades, sprayCautions } from '../../../../shared/domain/conflict-grading.js';
import { hoursDuringBeeFlight } from '../../../../shared/domain/bee-flight.js';
import type { ConflictColonies, SprayCheckResult, SprayConflict } from '../../../../shared/schemas/sprays.js';
import { searchConflicts, type ExposureRow, type SprayedBlockRow } from './conflicts.queries.js';

const HOUR_MS = 3_600_000;

export interface CheckInput {
  farmId: string;
  blockIds: string[];
  /** The spray itself: the planned window, or from the applied time on. */
  from: Date;
  to: Date;
  ld50UgPerBee: number | null;
  rt25Hours: number | null;
  bufferM: number;
  /** When beekeepers were (or would be) told of this timing. */
  noticedAt: Date;
}

export interface CheckOutput extends SprayCheckResult {
  blocks: SprayedBlockRow[];
}

function groupColonies(rows: ExposureRow[]): ConflictColonies {
  const sites = new Map<string, ConflictColonies['dropSites'][number]>();
  for (const r of rows) {
    const site = sites.get(r.drop_site_id) ?? { id: r.drop_site_id, name: r.drop_site_name, blockName: r.block_name, lon: r.lon, lat: r.lat, colonies: 0, distanceM: Math.round(r.distance_m), placed: false };
    site.colonies += r.colonies;
    site.placed ||= r.placed;
    sites.set(r.drop_site_id, site);
  }
  const dropSites = [...sites.values()].sort((a, b) => a.distanceM - b.distanceM);
  return {
    apiaryId: rows[0].apiary_id,
    apiaryName: rows[0].apiary_name,
    colonies: dropSites.reduce((sum, s) => sum + s.colonies, 0),
    distanceM: dropSites[0].distanceM,
    dropSites,
  };
}

export async function runConflictCheck(sequelize: Sequelize, input: CheckInput, transaction?: Transaction | null): Promise<CheckOutput> {
  const hazard = productBeeHazard({ ld50UgPerBee: input.ld50UgPerBee, rt25Hours: input.rt25Hours });
  const exposureTo = new Date(input.to.getTime() + hazard.residualHours * HOUR_MS);
  const scope = { farmId: input.farmId, blockIds: input.blockIds, from: input.from, to: input.to, exposureTo, bufferM: input.bufferM };
  const { blocks, exposures, duringBloom } = await searchConflicts(sequelize, scope, transaction);
  // Flight hours at the first sprayed block's centre: the blocks of one plan lie close together.
  const flightHours = blocks.length ? hoursDuringBeeFlight(input.from, input.to, blocks[0].lat, blocks[0].lon) : 0;
  const noticeGivenHours = (input.from.getTime() - input.noticedAt.getTime()) / HOUR_MS;

  const byApiary = new Map<string, ExposureRow[]>();
  for (const row of exposures) {
    const rows = byApiary.get(row.apiary_id) ?? [];
    rows.push(row);
    byApiary.set(row.apiary_id, rows);
  }

  const conflicts: SprayConflict[] = [];
  for (const rows of byApiary.values()) {
    const colonies = groupColonies(rows);
    const graded = gradeConflict({
      hazard,
      duringBloom,
      colonies: colonies.colonies,
      distanceM: colonies.distanceM,
      bufferM: input.bufferM,
      contractedOnSprayedBlock: rows.some((r) => r.on_sprayed_block && r.agreement_state === 'in-force' && r.during_spray),
      presentDuringSpray: rows.some((r) => r.during_spray),
      noticeGivenHours,
      noticeAgreedHours: Math.max(...rows.map((r) => r.notice_hours)),
      hoursDuringBeeFlight: flightHours,
    });
    if (graded) conflicts.push({ apiaryId: colonies.apiaryId, apiaryName: colonies.apiaryName, ...graded, colonies });
  }
  if (!conflicts.length) {
    // Bloom alone concerns the farm: it is graded without colonies.
    const graded = gradeConflict({
      hazard, duringBloom, colonies: 0, distanceM: 0, bufferM: input.bufferM, contractedOnSprayedBlock: false, presentDuringSpray: false,
      noticeGivenHours, noticeAgreedHours: null, hoursDuringBeeFlight: flightHours,
    });
    if (graded) conflicts.push({ apiaryId: null, apiaryName: null, ...graded, colonies: null });
  }
  conflicts.sort((a, b) => compareGrades(a.grade, b.grade));

  return {
    hazard,
    exposureEndsAt: exposureTo.toISOString(),
    bufferM: input.bufferM,
    duringBloom,
    conflicts,
    cautions: [...sprayCautions],
    blocks,
  };
}
