// The standard clauses of a Pollenpact pollination agreement, in our own words, filled in
// from the agreed terms. They cover what published sample agreements cover (UMN
// Extension; UF/IFAS EDIS "Sample Pollination Agreement" 2015; SARE "Managing Alternative
// Pollinators"): fees and due dates, dates and notice, number and strength of colonies,
// placement and access, inspection, pesticide assurances and notice, water, liability,
// extra moves and entry. The fee, extra-move and strength-shortfall wording comes from
// agreement-billing.ts, which also computes what the invoice charges for them.
import { extraMovesClauseText, feeClauseText, shortfallClauseText } from './agreement-billing.js';

export interface AgreementClause {
  key: string;
  title: string;
  text: string;
}

export interface ClauseTerms {
  colonies: number;
  minFramesOfBees: number;
  minFramesOfBrood: number | null;
  pricePerColonyCents: number;
  currency: string;
  depositShareBp: number;
  balanceDueDays: number;
  lateInterestBpPerMonth: number;
  belowMinimumRateBp: number;
  extraMoveFeeCents: number;
  noticeHours: number;
  removalNoticeHours: number;
}

export function agreementClauses(t: ClauseTerms): AgreementClause[] {
  const brood = t.minFramesOfBrood != null ? ` and at least ${t.minFramesOfBrood} frames of brood` : '';
  const clauses: AgreementClause[] = [
    {
      key: 'colonies',
      title: 'Colonies supplied',
      text: `The beekeeper sets down ${t.colonies} colonies, each headed by a laying queen, holding on average at least ${t.minFramesOfBees} frames well covered with adult bees${brood}, free of visible disease, at the drop sites listed in this agreement.`,
    },
    {
      key: 'inspection',
      title: 'Strength check',
      text: 'The grower, or an inspector the grower names, may have a random sample of at least one colony in ten opened to count frames of bees, with the beekeeper or the crew present. Colonies found below the minimum count against those above it; the group meets this agreement when the shortfall is made up.',
    },
    {
      key: 'fee',
      title: 'Fee and payment',
      text: feeClauseText(t),
    },
    {
      key: 'pesticides',
      title: 'Pesticides',
      text: `The grower tells the beekeeper at least ${t.noticeHours} hours before any pesticide is applied on or next to the blocks, and asks neighbours who spray to do the same. While colonies are on site the grower applies no product that is toxic to bees on the blocks unless the beekeeper agrees in writing beforehand. The product label is the law; local regulations and licensed applicators decide how a product may be used.`,
    },
    {
      key: 'water',
      title: 'Water',
      text: 'The grower provides clean water within reach of the colonies for as long as they are on site, unless the beekeeper has agreed to bring it.',
    },
    {
      key: 'access',
      title: 'Access and entry',
      text: 'The grower keeps a way to each drop site open for the beekeeper’s vehicles, day and night, and lets the beekeeper and the crew enter to tend, check and move the colonies.',
    },
    {
      key: 'removal',
      title: 'Moving in and out',
      text: `The beekeeper removes the colonies within ${t.removalNoticeHours} hours of the grower’s notice that they may go, or at the agreed pickup date.`,
    },
    {
      key: 'extra-moves',
      title: 'Extra moves',
      text: extraMovesClauseText(t),
    },
    {
      key: 'liability',
      title: 'Liability',
      text: 'The beekeeper answers for the colonies and for harm they cause through the beekeeper’s neglect. The grower answers for harm to the colonies caused by the grower’s own acts, including sprays applied against this agreement. Neither answers for theft, vandalism, flood or fire that they could not prevent.',
    },
    {
      key: 'changes',
      title: 'Changes',
      text: 'Once both sides have confirmed this agreement it is fixed. Any change is made by an amendment that both sides confirm.',
    },
  ];
  // Always stated, a reduced rate of 0 included: the invoice applies this rule to every
  // checked group, so the agreement must say what a group that falls short is charged.
  clauses.splice(3, 0, {
    key: 'below-minimum',
    title: 'Colonies below strength',
    text: shortfallClauseText(t),
  });
  return clauses;
}
