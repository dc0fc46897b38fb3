// The database, declared once. Row types for every table come from here.
// Timestamps are ISO-8601 strings in UTC; ids are random (UUID) so devices can create rows offline.
import type { ColumnType, Generated, Insertable, Selectable, Updateable } from "kysely";

import type { Role } from "@/lib/band/roles";

export interface UsersTable {
  id: string;
  email: string; // stored lower-case
  name: string;
  password_hash: string | null; // null for accounts made through a sign-in link
  default_instrument: string; // instrument id, see lib/music/instruments
  created_at: string;
  /** Bumped to end every session of the user at once. */
  session_version: ColumnType<number, number | undefined, number>;
  /** When the address was proven by an opened sign-in link; null until then. */
  email_verified_at: ColumnType<string | null, string | null | undefined, string | null>;
}

export interface BandsTable {
  id: string;
  name: string;
  city: string | null;
  created_by: string;
  created_at: string;
}

export interface MembershipsTable {
  band_id: string;
  user_id: string;
  role: Role;
  instrument: string; // instrument id the player reads by default
  expires_at: string | null; // a sub's access can end
  created_at: string;
}

export interface InvitesTable {
  id: string;
  band_id: string;
  token_hash: string; // sha256 of the token in the link; the token itself is never stored
  email: string;
  role: Role;
  instrument: string;
  invited_by: string;
  expires_at: string;
  access_expires_at: string | null; // for subs: when the membership created by this invite ends
  accepted_at: string | null;
  created_at: string;
}

export interface ChartsTable {
  id: string;
  band_id: string;
  title: string;
  composer: string;
  concert_key: string;
  meter: string; // "4/4"
  tempo: number | null;
  feel: string;
  body_json: string; // the parsed chart (lib/chart model) as JSON text, spliced into sync responses
  source_text: string; // the chart text as written
  revision: number;
  updated_by: string;
  updated_at: string;
  deleted_at: string | null; // tombstone
}

export interface ChartRevisionsTable {
  id: string;
  chart_id: string;
  band_id: string;
  revision: number;
  title: string;
  body_json: string;
  source_text: string;
  meta_json: string; // composer, key, meter, tempo, feel at that revision
  message: string;
  author_id: string;
  created_at: string;
}

export interface SetlistsTable {
  id: string;
  band_id: string;
  name: string;
  starts_at: string | null;
  venue: string;
  notes: string;
  revision: number;
  updated_by: string;
  updated_at: string;
  deleted_at: string | null;
  /** The length the leader wants for each set, in minutes: JSON array, index 0 = set 1 (null = not set). */
  set_minutes_json: ColumnType<string, string | undefined, string>;
}

export interface SetlistEntriesTable {
  id: string;
  setlist_id: string;
  band_id: string;
  set_number: number; // set 1, set 2 …
  position: number;
  chart_id: string;
  key: string | null; // concert key for this gig (a singer's key); null = the chart's key
  intro_json: string | null; // intro choice: { kind, bars?, repeats?, tritoneSub?, vamp? }
  ending: string | null; // ending choice as JSON text
  tempo: number | null;
  solo_order: string;
  /** Choruses each soloist takes on this tune tonight. */
  choruses: ColumnType<number, number | undefined, number>;
  /** 1 = no intro tonight (straight in at the top), even where the chart has its own. */
  straight_in: ColumnType<number, number | undefined, number>;
  notes: string;
}

/** Charts put away: tombstoned in `charts` like a delete, kept here so they can be brought back. */
export interface ChartArchiveTable {
  chart_id: string;
  band_id: string;
  archived_at: string;
  archived_by: string;
}

export interface AnnotationsTable {
  id: string;
  user_id: string;
  band_id: string;
  chart_id: string;
  data_json: string;
  revision: number;
  updated_at: string;
  deleted_at: string | null;
}

export interface AttachmentsTable {
  id: string;
  band_id: string;
  chart_id: string;
  filename: string;
  path: string; // relative to the data folder
  sha256: string;
  size: number;
  type: string; // MIME type
  pages: number | null;
  /** What the part is called ("2nd trumpet"); null on parts uploaded before it was asked. */
  part_name: string | null;
  /** The instrument id the part is for; null on older parts. */
  instrument: string | null;
  uploaded_by: string;
  created_at: string;
  deleted_at: string | null;
}

export interface SharesTable {
  id: string;
  band_id: string;
  setlist_id: string;
  user_id: string | null; // filled when the sub accepts
  email: string;
  token_hash: string;
  expires_at: string;
  created_by: string;
  created_at: string;
  revoked_at: string | null;
}

export interface ChangesTable {
  seq: Generated<number>;
  band_id: string;
  entity: string; // "chart" | "setlist" | "membership" | "band" | "annotation" | "attachment" | …
  entity_id: string;
  op: "upsert" | "delete";
  user_id: string | null; // set for private rows (annotations): only that user receives them
  created_at: string;
}

export interface AppliedMutationsTable {
  id: string; // mutation id chosen by the device
  band_id: string;
  user_id: string;
  result_json: string; // the first result, returned again on a re-send
  created_at: string;
}

export interface SubscriptionsTable {
  band_id: string;
  plan: "free" | "band";
  status: string; // "active" | "canceled" | "past_due" | "incomplete"
  customer_id: string | null;
  subscription_id: string | null;
  current_period_end: string | null;
  cancel_at_period_end: ColumnType<number, number | undefined, number>;
  updated_at: string;
}

export interface LoginAttemptsTable {
  key: string; // lower-cased e-mail
  failures: number;
  locked_until: string | null;
  updated_at: string;
}

export interface SignInTokensTable {
  token_hash: string;
  email: string;
  expires_at: string;
  used_at: string | null;
}

/** Where the band's last "charts updated" notice stopped in the change feed. */
export interface BandDigestsTable {
  band_id: string;
  last_seq: number;
  sent_at: string;
  sent_by: string;
}

/** The server's VAPID key pair (one row, "vapid"), made on first start. */
export interface PushKeysTable {
  id: string;
  public_key: string; // base64url, uncompressed P-256 point
  private_key: string; // base64url
  created_at: string;
}

/** One device's Web Push subscription for one band it holds. */
export interface PushSubscriptionsTable {
  id: string;
  band_id: string;
  user_id: string;
  device_id: string;
  endpoint: string;
  p256dh: string;
  auth: string;
  created_at: string;
  last_sent_at: string | null;
}

/** What a device said it holds at its last pull (readiness for tonight). */
export interface DeviceReportsTable {
  device_id: string;
  band_id: string;
  user_id: string;
  label: string; // "Chromium on Linux", shown to the leader
  cursor: number;
  holdings_json: string; // { charts: {id: revision}, setlists: {id: revision}, parts: string[] }
  reported_at: string;
}

/** A tune the leader (or the caller they chose) called on a gig: the feed followers read. */
export interface GigCallsTable {
  seq: Generated<number>;
  band_id: string;
  setlist_id: string;
  entry_id: string;
  chart_id: string;
  called_by: string;
  created_at: string;
}

/** Who calls the tunes on a gig when it is not the leader. */
export interface GigCallersTable {
  setlist_id: string;
  band_id: string;
  user_id: string;
  set_by: string;
  set_at: string;
}

export interface Database {
  users: UsersTable;
  bands: BandsTable;
  memberships: MembershipsTable;
  invites: InvitesTable;
  charts: ChartsTable;
  chart_revisions: ChartRevisionsTable;
  setlists: SetlistsTable;
  setlist_entries: SetlistEntriesTable;
  chart_archive: ChartArchiveTable;
  annotations: AnnotationsTable;
  attachments: AttachmentsTable;
  shares: SharesTable;
  changes: ChangesTable;
  applied_mutations: AppliedMutationsTable;
  subscriptions: SubscriptionsTable;
  login_attempts: LoginAttemptsTable;
  sign_in_tokens: SignInTokensTable;
  band_digests: BandDigestsTable;
  push_keys: PushKeysTable;
  push_subscriptions: PushSubscriptionsTable;
  device_reports: DeviceReportsTable;
  gig_calls: GigCallsTable;
  gig_callers: GigCallersTable;
  rate_limits: RateLimitsTable;
  ended_sessions: EndedSessionsTable;
}

/** rate-limiter-flexible's rows (its own layout); expire is epoch milliseconds. */
export interface RateLimitsTable {
  key: string;
  points: number;
  expire: number | null;
}

/** A session ended by signing out, kept until its token would have expired anyway. */
export interface EndedSessionsTable {
  sid: string;
  user_id: string;
  ends_at: string;
}

export type User = Selectable<UsersTable>;
export type Band = Selectable<BandsTable>;
export type Membership = Selectable<MembershipsTable>;
export type Invite = Selectable<InvitesTable>;
export type ChartRow = Selectable<ChartsTable>;
export type NewChartRow = Insertable<ChartsTable>;
export type ChartRowUpdate = Updateable<ChartsTable>;
export type ChartRevisionRow = Selectable<ChartRevisionsTable>;
export type SetlistRow = Selectable<SetlistsTable>;
export type SetlistEntryRow = Selectable<SetlistEntriesTable>;
export type AnnotationRow = Selectable<AnnotationsTable>;
export type AttachmentRow = Selectable<AttachmentsTable>;
export type ShareRow = Selectable<SharesTable>;
export type ChangeRow = Selectable<ChangesTable>;
export type SubscriptionRow = Selectable<SubscriptionsTable>;
