/**
 * The Railwright data model. Money is integer minor units (cents); times are
 * epoch milliseconds; JSON columns hold the engine's own typed documents.
 */
import { sql } from 'drizzle-orm';
import { index, integer, sqliteTable, text, uniqueIndex, type AnySQLiteColumn } from 'drizzle-orm/sqlite-core';
import { BRIEF_STATES, type BriefState } from '../../briefs/states';
import { QUOTE_LINE_KINDS } from '../../quotes/pricing';
import { user } from './auth-schema';

export * from './auth-schema';

const id = () =>
  text('id')
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID());
const createdAt = () =>
  integer('created_at', { mode: 'timestamp_ms' })
    .notNull()
    .default(sql`(cast(unixepoch('subsecond') * 1000 as integer))`);
const updatedAt = () =>
  integer('updated_at', { mode: 'timestamp_ms' })
    .notNull()
    .default(sql`(cast(unixepoch('subsecond') * 1000 as integer))`)
    .$onUpdateFn(() => new Date());

export { BRIEF_STATES, type BriefState };

export const QUOTE_STATES = ['draft', 'sent', 'accepted', 'deposit-paid', 'declined', 'expired', 'withdrawn'] as const;
export type QuoteState = (typeof QUOTE_STATES)[number];

export const clientProfile = sqliteTable('client_profile', {
  userId: text('user_id')
    .primaryKey()
    .references(() => user.id, { onDelete: 'cascade' }),
  company: text('company').notNull(),
  phone: text('phone'),
  /** Where the balance invoice is addressed, as the client wrote it (lines). */
  billingAddress: text('billing_address').notNull().default(''),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const brief = sqliteTable(
  'brief',
  {
    id: id(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => user.id),
    title: text('title').notNull(),
    state: text('state', { enum: BRIEF_STATES }).notNull().default('draft'),
    /** The supply brief as the engine's schema defines it (JSON). */
    spec: text('spec', { mode: 'json' }).notNull(),
    notes: text('notes').notNull().default(''),
    /** Denormalised for the desk table: the engine's pick and its headline figures at submission. */
    recommendedTopology: text('recommended_topology'),
    summary: text('summary', { mode: 'json' }),
    submittedAt: integer('submitted_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('brief_owner_idx').on(t.ownerId), index('brief_state_idx').on(t.state, t.submittedAt)],
);

export const FILE_KINDS = ['schematic', 'datasheet', 'photo', 'load-log', 'other'] as const;

export const briefFile = sqliteTable(
  'brief_file',
  {
    id: id(),
    briefId: text('brief_id')
      .notNull()
      .references(() => brief.id, { onDelete: 'cascade' }),
    uploadedBy: text('uploaded_by')
      .notNull()
      .references(() => user.id),
    kind: text('kind', { enum: FILE_KINDS }).notNull(),
    originalName: text('original_name').notNull(),
    /** Random name in the upload store; never derived from what the uploader typed. */
    storageKey: text('storage_key').notNull().unique(),
    mimeType: text('mime_type').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    /** For load logs: the reduced figures (iMin, iTyp, iRms, iMax, samples). */
    loadSummary: text('load_summary', { mode: 'json' }),
    /** The thread message this file was sent with, if any. */
    messageId: text('message_id').references((): AnySQLiteColumn => briefMessage.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('brief_file_brief_idx').on(t.briefId), index('brief_file_message_idx').on(t.messageId)],
);

export const briefNote = sqliteTable(
  'brief_note',
  {
    id: id(),
    briefId: text('brief_id')
      .notNull()
      .references(() => brief.id, { onDelete: 'cascade' }),
    authorId: text('author_id')
      .notNull()
      .references(() => user.id),
    body: text('body').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('brief_note_brief_idx').on(t.briefId)],
);

/** The kinds of notice e-mail a person turned off on their account page (receipts and account mail cannot be). */
export const mailOptOut = sqliteTable(
  'mail_opt_out',
  {
    userId: text('user_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    kind: text('kind').notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('mail_opt_out_user_kind_idx').on(t.userId, t.kind)],
);

/** Each submitted version of a brief's spec, numbered from 1, so a resubmission after requested changes keeps the one before. */
export const briefSpecVersion = sqliteTable(
  'brief_spec_version',
  {
    id: id(),
    briefId: text('brief_id')
      .notNull()
      .references(() => brief.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    spec: text('spec', { mode: 'json' }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('brief_spec_version_number_idx').on(t.briefId, t.number)],
);

/** The thread between a brief's client and the consultancy: seen by both sides, unlike the internal notes. */
export const briefMessage = sqliteTable(
  'brief_message',
  {
    id: id(),
    briefId: text('brief_id')
      .notNull()
      .references(() => brief.id, { onDelete: 'cascade' }),
    authorId: text('author_id')
      .notNull()
      .references(() => user.id),
    body: text('body').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('brief_message_brief_idx').on(t.briefId, t.createdAt)],
);

/** Up to when a person has read a brief's thread: messages from the other side after it count as unread. */
export const briefRead = sqliteTable(
  'brief_read',
  {
    userId: text('user_id')
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    briefId: text('brief_id')
      .notNull()
      .references(() => brief.id, { onDelete: 'cascade' }),
    readAt: integer('read_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [uniqueIndex('brief_read_user_brief_idx').on(t.userId, t.briefId)],
);

export const designRevision = sqliteTable(
  'design_revision',
  {
    id: id(),
    briefId: text('brief_id')
      .notNull()
      .references(() => brief.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    authorId: text('author_id')
      .notNull()
      .references(() => user.id),
    topology: text('topology').notNull(),
    weights: text('weights', { mode: 'json' }),
    overrides: text('overrides', { mode: 'json' }),
    /** The brief as evaluated and the engine's full result, so a revision never changes after saving. */
    input: text('input', { mode: 'json' }).notNull(),
    result: text('result', { mode: 'json' }).notNull(),
    note: text('note').notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('design_revision_number_idx').on(t.briefId, t.number)],
);

export const quote = sqliteTable(
  'quote',
  {
    id: id(),
    briefId: text('brief_id')
      .notNull()
      .references(() => brief.id),
    revisionId: text('revision_id')
      .notNull()
      .references(() => designRevision.id),
    /** Sequential per year, e.g. RW-2026-0007. */
    number: text('number').notNull().unique(),
    year: integer('year').notNull(),
    sequence: integer('sequence').notNull(),
    state: text('state', { enum: QUOTE_STATES }).notNull().default('draft'),
    currency: text('currency').notNull(),
    quantity: integer('quantity').notNull().default(1),
    /** Tax and deposit as basis points (1 % = 100) so all arithmetic stays in integers. */
    taxRateBp: integer('tax_rate_bp').notNull(),
    depositBp: integer('deposit_bp').notNull(),
    subtotalMinor: integer('subtotal_minor').notNull().default(0),
    taxMinor: integer('tax_minor').notNull().default(0),
    totalMinor: integer('total_minor').notNull().default(0),
    depositMinor: integer('deposit_minor').notNull().default(0),
    terms: text('terms').notNull().default(''),
    validUntil: integer('valid_until', { mode: 'timestamp_ms' }).notNull(),
    createdBy: text('created_by')
      .notNull()
      .references(() => user.id),
    sentAt: integer('sent_at', { mode: 'timestamp_ms' }),
    acceptedAt: integer('accepted_at', { mode: 'timestamp_ms' }),
    /** The client's purchase-order number, given on acceptance; printed on the receipt. */
    purchaseOrder: text('purchase_order'),
    /** Why the client declined, in their words. */
    declineReason: text('decline_reason'),
    /** Words for the client: the only free text of the engineer's that reaches the quote page, the PDF and the e-mail. */
    clientNote: text('client_note').notNull().default(''),
    /** Internal: why a design that does not meet the brief was quoted all the same. */
    infeasibleReason: text('infeasible_reason'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex('quote_year_sequence_idx').on(t.year, t.sequence),
    index('quote_brief_idx').on(t.briefId),
    // The lapsed-quote sweep runs before every brief or quote read.
    index('quote_state_valid_until_idx').on(t.state, t.validUntil),
  ],
);

export { QUOTE_LINE_KINDS };

export const quoteLine = sqliteTable(
  'quote_line',
  {
    id: id(),
    quoteId: text('quote_id')
      .notNull()
      .references(() => quote.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    kind: text('kind', { enum: QUOTE_LINE_KINDS }).notNull(),
    description: text('description').notNull(),
    /** Quantity in thousandths (hours 12.5 → 12500) to keep money arithmetic exact. */
    quantityMilli: integer('quantity_milli').notNull(),
    unit: text('unit').notNull(),
    unitPriceMinor: integer('unit_price_minor').notNull(),
    totalMinor: integer('total_minor').notNull(),
  },
  (t) => [index('quote_line_quote_idx').on(t.quoteId, t.position)],
);

export const PAYMENT_STATES = ['pending', 'paid', 'failed', 'expired', 'refunded'] as const;
export type PaymentState = (typeof PAYMENT_STATES)[number];
/** What a payment is for: the deposit that starts design work, the balance at delivery, or money given back. */
export const PAYMENT_KINDS = ['deposit', 'balance', 'refund'] as const;
export type PaymentKind = (typeof PAYMENT_KINDS)[number];

export const payment = sqliteTable(
  'payment',
  {
    id: id(),
    quoteId: text('quote_id')
      .notNull()
      .references(() => quote.id),
    kind: text('kind', { enum: PAYMENT_KINDS }).notNull().default('deposit'),
    provider: text('provider').notNull().default('stripe'),
    checkoutSessionId: text('checkout_session_id').notNull().unique(),
    paymentIntentId: text('payment_intent_id'),
    amountMinor: integer('amount_minor').notNull(),
    currency: text('currency').notNull(),
    state: text('state', { enum: PAYMENT_STATES }).notNull().default('pending'),
    paidAt: integer('paid_at', { mode: 'timestamp_ms' }),
    /** A refund's payment given back, the staff member who gave it (none when the product refunded it itself) and why. */
    refundOf: text('refund_of').references((): AnySQLiteColumn => payment.id),
    refundedBy: text('refunded_by').references(() => user.id),
    refundReason: text('refund_reason'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index('payment_quote_idx').on(t.quoteId),
    // A quote's deposit is paid once, whichever of the webhook and the quote page's check applies it first.
    uniqueIndex('payment_one_paid_deposit_idx')
      .on(t.quoteId)
      .where(sql`kind = 'deposit' and state = 'paid'`),
    // A quote has one invoice, so this is one paid balance per invoice, however its payment is confirmed.
    uniqueIndex('payment_one_paid_balance_idx')
      .on(t.quoteId)
      .where(sql`kind = 'balance' and state = 'paid'`),
  ],
);

export const INVOICE_STATES = ['issued', 'paid'] as const;
export type InvoiceState = (typeof INVOICE_STATES)[number];

/**
 * The balance invoice issued when a design is delivered: one per quote,
 * numbered in a sequence of its own per year. The figures, the client's billing
 * address and PO and our identifiers are kept as issued, so the PDF read later
 * is the one that was sent.
 */
export const invoice = sqliteTable(
  'invoice',
  {
    id: id(),
    quoteId: text('quote_id')
      .notNull()
      .unique()
      .references(() => quote.id),
    /** Sequential per year, e.g. INV-2026-0003. */
    number: text('number').notNull().unique(),
    year: integer('year').notNull(),
    sequence: integer('sequence').notNull(),
    state: text('state', { enum: INVOICE_STATES }).notNull().default('issued'),
    currency: text('currency').notNull(),
    taxRateBp: integer('tax_rate_bp').notNull(),
    netMinor: integer('net_minor').notNull(),
    taxMinor: integer('tax_minor').notNull(),
    grossMinor: integer('gross_minor').notNull(),
    depositPaidMinor: integer('deposit_paid_minor').notNull(),
    balanceMinor: integer('balance_minor').notNull(),
    purchaseOrder: text('purchase_order'),
    billingAddress: text('billing_address').notNull().default(''),
    registrationNumber: text('registration_number').notNull().default(''),
    taxId: text('tax_id').notNull().default(''),
    issuedAt: integer('issued_at', { mode: 'timestamp_ms' }).notNull(),
    paidAt: integer('paid_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('invoice_year_sequence_idx').on(t.year, t.sequence)],
);
export type InvoiceRow = typeof invoice.$inferSelect;

/** Each provider event id is processed once; a replay finds its row and changes nothing. */
export const webhookEvent = sqliteTable('webhook_event', {
  id: text('id').primaryKey(),
  provider: text('provider').notNull().default('stripe'),
  type: text('type').notNull(),
  outcome: text('outcome').notNull(),
  receivedAt: createdAt(),
});

export const MAIL_STATES = ['sent', 'failed'] as const;

export const mailLog = sqliteTable(
  'mail_log',
  {
    id: id(),
    kind: text('kind').notNull(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    bodyText: text('body_text').notNull(),
    attachmentName: text('attachment_name'),
    state: text('state', { enum: MAIL_STATES }).notNull(),
    error: text('error'),
    messageId: text('message_id'),
    relatedId: text('related_id'),
    createdAt: createdAt(),
  },
  (t) => [index('mail_log_created_idx').on(t.createdAt)],
);

export const OUTBOX_STATES = ['queued', 'sent', 'failed'] as const;

/**
 * Mail to be sent, written in the same transaction as the change it tells of
 * and delivered (and retried) by the outbox worker of any app instance, so a
 * crash between the two neither loses the mail nor the change.
 */
export const mailOutbox = sqliteTable(
  'mail_outbox',
  {
    id: id(),
    kind: text('kind').notNull(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    bodyText: text('body_text').notNull(),
    bodyHtml: text('body_html'),
    /** Files to attach, their bytes in base64 (a quote's PDF as it was sent). */
    attachments: text('attachments', { mode: 'json' }).$type<{ filename: string; contentType: string; base64: string }[]>(),
    relatedId: text('related_id'),
    state: text('state', { enum: OUTBOX_STATES }).notNull().default('queued'),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: integer('next_attempt_at', { mode: 'timestamp_ms' }).notNull(),
    /** Held by one worker until then; a worker that died lets it go when the time passes. */
    claimedUntil: integer('claimed_until', { mode: 'timestamp_ms' }),
    lastError: text('last_error'),
    sentAt: integer('sent_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (t) => [index('mail_outbox_due_idx').on(t.state, t.nextAttemptAt), index('mail_outbox_related_idx').on(t.relatedId)],
);
export type OutboxRow = typeof mailOutbox.$inferSelect;

/** One row: the consultancy's prices. Hours by topology and complexity drivers are JSON maps. */
export const rateCard = sqliteTable('rate_card', {
  id: integer('id').primaryKey(),
  currency: text('currency').notNull(),
  hourlyRateMinor: integer('hourly_rate_minor').notNull(),
  designHoursByTopology: text('design_hours_by_topology', { mode: 'json' }).$type<Record<string, number>>().notNull(),
  complexityHours: text('complexity_hours', { mode: 'json' }).$type<Record<string, number>>().notNull(),
  hvReviewMinor: integer('hv_review_minor').notNull(),
  prototypePerUnitMinor: integer('prototype_per_unit_minor').notNull(),
  testReportMinor: integer('test_report_minor').notNull(),
  taxRateBp: integer('tax_rate_bp').notNull(),
  depositBp: integer('deposit_bp').notNull(),
  validityDays: integer('validity_days').notNull(),
  /** The consultancy's company registration number and tax (VAT) id, printed on its invoices. */
  registrationNumber: text('registration_number').notNull().default(''),
  taxId: text('tax_id').notNull().default(''),
  updatedBy: text('updated_by').references(() => user.id),
  updatedAt: updatedAt(),
});

/** The engine's typical device parameters, editable by admins and passed into every evaluation. */
export const deviceClass = sqliteTable('device_class', {
  id: text('id').primaryKey(),
  kind: text('kind').notNull(),
  name: text('name').notNull(),
  params: text('params', { mode: 'json' }).notNull(),
  updatedBy: text('updated_by').references(() => user.id),
  updatedAt: updatedAt(),
});

/** Who moved what from which state to which, and when. */
export const stateChange = sqliteTable(
  'state_change',
  {
    id: id(),
    subjectType: text('subject_type', { enum: ['brief', 'quote'] }).notNull(),
    subjectId: text('subject_id').notNull(),
    fromState: text('from_state'),
    toState: text('to_state').notNull(),
    actorId: text('actor_id').references(() => user.id),
    note: text('note').notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [index('state_change_subject_idx').on(t.subjectType, t.subjectId, t.createdAt)],
);

/** Fixed-window counters shared by every app instance (sign-in, evaluate). */
export const rateLimit = sqliteTable('rate_limit', {
  key: text('key').primaryKey(),
  windowStart: integer('window_start').notNull(),
  count: integer('count').notNull(),
});

// Row types live beside their tables, so a module that only reads a row needs nothing else.
export type BriefRow = typeof brief.$inferSelect;
export type BriefFileRow = typeof briefFile.$inferSelect;
export type RevisionRow = typeof designRevision.$inferSelect;
export type QuoteRow = typeof quote.$inferSelect;
export type QuoteLineRow = typeof quoteLine.$inferSelect;
export type PaymentRow = typeof payment.$inferSelect;
