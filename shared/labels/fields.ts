// The words for an input field, for messages that name the fields to check ("Please check:
// Blocks, End."). Keys are the schema's own names; a key not listed is spelled out from its
// camelCase, without the storage units (cents, basis points, ids) a person never types.

const fieldLabels: Record<string, string> = {
  accessNotes: 'Access notes', accuracyM: 'Position accuracy', activeIngredients: 'Active ingredients', agreementId: 'Agreement',
  amountCents: 'Amount', applicatorName: 'Applicator', appliedAt: 'Applied at', arrive: 'Arrival', balanceDueDays: 'Days until the balance is due',
  baseF: 'Base temperature', belowMinimumRateBp: 'Rate for colonies below the minimum', blockId: 'Block', blockIds: 'Blocks', blocks: 'Blocks',
  bloomStart: 'Bloom start', body: 'The form', checkedAt: 'Checked at', checkedOn: 'Checked on', colonies: 'Colonies',
  coloniesDelivered: 'Colonies dropped off', coloniesInGroup: 'Colonies in the group', coloniesOwned: 'Colonies owned', coloniesPerAcre: 'Colonies per acre',
  coloniesPickedUp: 'Colonies picked up', coloniesPlanned: 'Colonies planned', coordinates: 'Position', countedColonies: 'Colonies counted',
  crop: 'Crop', currency: 'Currency', ddHighF: 'Degree days (high)', ddLowF: 'Degree days (low)', degreeDayStart: 'Degree days from',
  deliveredAt: 'Dropped off at', depart: 'Departure', depositShareBp: 'Deposit share', dropSites: 'Drop sites', email: 'E-mail', endsAt: 'End',
  enteredAcres: 'Area', epaRegNo: 'EPA registration number', expectedOnSite: 'Expected on site', extraMoveFeeCents: 'Fee per extra move',
  extraMoves: 'Extra moves', framesOfBees: 'Frames of bees', framesOfBrood: 'Frames of brood', from: 'From', fullBloom: 'Full bloom',
  gateCode: 'Gate code', id: 'The address', invoiceId: 'Invoice', lateInterestBpPerMonth: 'Late interest per month', ld50UgPerBee: 'LD50',
  location: 'Position', maxDistanceKm: 'Distance', method: 'Method', minFramesOfBees: 'Minimum frames of bees', minFramesOfBrood: 'Minimum frames of brood',
  moths: 'Moths in the trap', name: 'Name', note: 'Note', notes: 'Notes', noticeHours: 'Spray notice', password: 'Password',
  petalFall: 'Petal fall', pickedUpAt: 'Picked up at', pricePerColonyCents: 'Price per colony', productName: 'Product',
  proposedPriceCents: 'Price offered', reason: 'Reason', receivedOn: 'Received on', reference: 'Reference', removalNoticeHours: 'Notice before removal',
  respondBy: 'Answer by', response: 'Answer', rt25Hours: 'RT25', startsAt: 'Start', targetPest: 'Target pest', taxRateBp: 'Tax rate',
  timeZone: 'Time zone', title: 'Title', to: 'To', treesPerAcre: 'Trees per acre', weatherStationId: 'Weather station', yearPlanted: 'Year planted',
};

/** "blockIds" -> "Blocks"; "dropSites.1.gateCode" -> "Gate code (drop sites, row 2)"; unknown keys spelled out. */
export function fieldLabel(path: string): string {
  const parts = path.split('.').filter(Boolean);
  const named = parts.filter((p) => !/^\d+$/.test(p));
  const last = named.at(-1) ?? 'body';
  const words = fieldLabels[last] ?? spellOut(last);
  const row = parts.find((p) => /^\d+$/.test(p));
  const parent = named.length > 1 ? named[0] : null;
  if (!parent || parent === 'body') return words;
  const where = fieldLabels[parent] ?? spellOut(parent);
  return row !== undefined ? `${words} (${where.toLowerCase()}, row ${Number(row) + 1})` : `${words} (${where.toLowerCase()})`;
}

function spellOut(key: string): string {
  const words = key.replace(/(Cents|Bp|Ids?|M|F)$/, '').replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase().trim() || key;
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** "Please check: Blocks, End." */
export function pleaseCheck(paths: string[]): string {
  return `Please check: ${[...new Set(paths.map(fieldLabel))].join(', ')}.`;
}
