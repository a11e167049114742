// Invoices, credit notes and payments: request schemas and the shapes the API answers with.
// Money is integer cents in the invoice's currency; dates are ISO dates in the billing
// business's time zone.
import { z } from 'zod';
import { idSchema, isoDateSchema } from './common.js';
import { invoiceStatuses, type InvoiceStatus, type PricedLineKind } from '../domain/invoice-pricing.js';

const cents = z.number({ message: 'must be an amount of money' }).int('must be rounded to the cent').positive('must be more than zero').max(100_000_000, 'is too large');
const note = z.string().trim().max(1000, 'must be at most 1000 characters');

export const invoiceStatusSchema = z.enum(invoiceStatuses);

export const draftInvoiceSchema = z.object({
  agreementId: idSchema,
  extraMoves: z.number().int('must be a whole number').min(0, 'cannot be negative').max(100, 'must be at most 100').default(0),
  notes: note.optional(),
});
export type DraftInvoiceInput = z.infer<typeof draftInvoiceSchema>;

export const updateDraftSchema = z.object({
  extraMoves: z.number().int('must be a whole number').min(0, 'cannot be negative').max(100, 'must be at most 100').optional(),
  notes: note.nullable().optional(),
});
export type UpdateDraftInput = z.infer<typeof updateDraftSchema>;

export const voidInvoiceSchema = z.object({ reason: z.string().trim().min(1, 'say why the invoice is void').max(500) });
export type VoidInvoiceInput = z.infer<typeof voidInvoiceSchema>;

export const creditNoteSchema = z.object({
  amountCents: cents,
  reason: z.string().trim().min(1, 'say what the credit corrects').max(500),
});
export type CreditNoteInput = z.infer<typeof creditNoteSchema>;

export const manualPaymentSchema = z.object({
  invoiceId: idSchema,
  method: z.enum(['cheque', 'bank-transfer'], { message: 'must be cheque or bank-transfer' }),
  amountCents: cents,
  receivedOn: isoDateSchema,
  reference: z.string().trim().max(120, 'must be at most 120 characters').optional(),
});
export type ManualPaymentInput = z.infer<typeof manualPaymentSchema>;

export const refundSchema = z.object({
  amountCents: cents,
  reason: z.string().trim().max(500).optional(),
});
export type RefundInput = z.infer<typeof refundSchema>;

export const invoiceListQuery = z.object({
  status: invoiceStatusSchema.optional(),
  season: z.coerce.number().int().min(2000).max(2100).optional(),
});
export type InvoiceListQuery = z.infer<typeof invoiceListQuery>;

export const checkoutSchema = z.object({ invoiceId: idSchema });
export type CheckoutInput = z.infer<typeof checkoutSchema>;

export interface InvoiceLineDto {
  id: string;
  kind: PricedLineKind;
  description: string;
  quantity: number;
  unitCents: number;
  amountCents: number;
}

export interface CreditNoteDto {
  id: string;
  number: string;
  amountCents: number;
  reason: string;
  createdAt: string;
}

export interface PaymentDto {
  id: string;
  method: 'online' | 'cheque' | 'bank-transfer';
  state: 'pending' | 'succeeded' | 'failed';
  amountCents: number;
  refundedCents: number;
  /** How much of it went beyond what was owed when it arrived (offered for refund). */
  overpaidCents: number;
  reference: string | null;
  failureMessage: string | null;
  receivedAt: string | null;
  createdAt: string;
}

export interface RefundDto {
  id: string;
  state: 'pending' | 'succeeded' | 'failed';
  amountCents: number;
  reason: string | null;
  createdAt: string;
}

export interface InvoiceSummaryDto {
  id: string;
  number: string | null;
  status: InvoiceStatus;
  agreementId: string;
  season: number;
  farm: { id: string; name: string };
  apiary: { id: string; name: string };
  currency: string;
  timeZone: string;
  totalCents: number;
  creditedCents: number;
  netTotalCents: number;
  paidCents: number;
  outstandingCents: number;
  /** Paid beyond the net total (two payments for one balance, say): to be refunded. */
  overpaidCents: number;
  depositCents: number;
  depositDueOn: string | null;
  balanceDueOn: string | null;
  accruedInterestCents: number;
  issuedAt: string | null;
}

export interface InvoiceDto extends InvoiceSummaryDto {
  extraMoves: number;
  subtotalCents: number;
  taxRateBp: number;
  taxCents: number;
  lateInterestBpPerMonth: number;
  reminderIntervalDays: number;
  notes: string | null;
  voidReason: string | null;
  lines: InvoiceLineDto[];
  creditNotes: CreditNoteDto[];
  payments: PaymentDto[];
  refunds: RefundDto[];
}

export interface BillableAgreementDto {
  id: string;
  farm: { id: string; name: string };
  colonies: number;
  coloniesDelivered: number;
  pricePerColonyCents: number;
  currency: string;
  onSiteFrom: string;
}

export interface ReceivablesDto {
  currency: string;
  seasonTotals: { invoicedCents: number; receivedCents: number; outstandingCents: number; overdueCents: number };
  byGrower: Array<{ farmId: string; farmName: string; invoices: number; netTotalCents: number; paidCents: number; outstandingCents: number }>;
  byStatus: Array<{ status: InvoiceStatus; invoices: number; outstandingCents: number }>;
  /** Weeks start on Monday in the business's time zone. */
  weekly: Array<{ weekStart: string; expectedCents: number; receivedCents: number }>;
}

export interface PayablesDto {
  currency: string;
  totals: { invoicedCents: number; paidCents: number; outstandingCents: number; overdueCents: number };
  blocks: Array<{ blockId: string; blockName: string; acres: number; colonies: number; costCents: number; costPerAcreCents: number }>;
}

export interface CheckoutDto {
  url: string;
}
