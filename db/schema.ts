// Kysely table types. Columns with database defaults are Generated<…>.
import type { ColumnType, Generated, Insertable, Selectable } from 'kysely';

type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
export type Role = 'owner' | 'editor' | 'viewer';
export type FileRole = 'original' | 'dxf' | 'dxf_in' | 'svg' | 'model';

export interface UsersTable {
  id: Generated<string>;
  email: string;
  name: string;
  password_hash: string;
  units: Generated<'mm' | 'in'>;
  created_at: Timestamp;
}
export interface SessionsTable {
  id: Generated<string>;
  user_id: string;
  created_at: Timestamp;
  expires_at: Timestamp;
  revoked_at: Timestamp | null;
}
export interface ShopsTable {
  id: Generated<string>;
  name: string;
  slug: string;
  created_at: Timestamp;
}
export interface MembershipsTable {
  shop_id: string;
  user_id: string;
  role: Role;
  created_at: Timestamp;
}
export interface InvitesTable {
  id: Generated<string>;
  shop_id: string;
  email: string;
  role: Role;
  token_hash: string;
  invited_by: string | null;
  expires_at: Timestamp;
  accepted_at: Timestamp | null;
  accepted_by: string | null;
  created_at: Timestamp;
}
export interface PasswordResetsTable {
  id: Generated<string>;
  user_id: string;
  token_hash: string;
  expires_at: Timestamp;
  used_at: Timestamp | null;
  created_at: Timestamp;
}
export interface DesignsTable {
  id: Generated<string>;
  shop_id: string;
  kind: 'insert' | 'jig' | 'template';
  title: string;
  description: Generated<string>;
  tags: Generated<string[]>;
  material: Generated<string>;
  author_id: string | null;
  forked_from_design_id: string | null;
  forked_from_revision_id: string | null;
  /** Lineage to a design outside an imported archive, in words (migration 0006). */
  forked_from_text: ColumnType<string | null, string | null | undefined, string | null>;
  /** The author's name from an imported archive, when they have no account in this shop (0006). */
  author_name: ColumnType<string | null, string | null | undefined, string | null>;
  latest_revision_number: Generated<number>;
  latest_status: Generated<string>;
  created_at: Timestamp;
  updated_at: Timestamp;
  search: ColumnType<string, never, never>;
}
export interface RevisionsTable {
  id: Generated<string>;
  design_id: string;
  number: number;
  message: Generated<string>;
  author_id: string | null;
  source: 'generated' | 'uploaded';
  generator_id: string | null;
  params: unknown | null;
  status: Generated<'draft' | 'trial' | 'proven' | 'retired'>;
  fit_notes: Generated<unknown>;
  summary: unknown;
  units: Generated<'mm' | 'in'>;
  /** The author's name from an imported archive, when they have no account in this shop (0006). */
  author_name: ColumnType<string | null, string | null | undefined, string | null>;
  created_at: Timestamp;
}
export interface RevisionFilesTable {
  revision_id: string;
  role: FileRole;
  object_key: string;
  content_type: string;
  bytes: number;
  sha256: string;
}
export interface ActivityTable {
  id: Generated<string>;
  shop_id: string;
  design_id: string | null;
  revision_id: string | null;
  actor_id: string | null;
  action: string;
  detail: Generated<unknown>;
  /** The actor's name from an imported archive, when they have no account in this shop (0006). */
  actor_name: ColumnType<string | null, string | null | undefined, string | null>;
  created_at: Timestamp;
}
export interface DevicesTable {
  id: Generated<string>;
  shop_id: string;
  name: string;
  width_mm: number;
  length_mm: number;
  thickness_mm: number;
  case_allowance_mm: Generated<number>;
  created_at: Timestamp;
}
export interface ChargersTable {
  id: Generated<string>;
  shop_id: string;
  name: string;
  shape: 'round' | 'rect';
  width_mm: number;
  length_mm: number;
  thickness_mm: number;
  range_min_mm: number | null;
  range_max_mm: number | null;
  created_at: Timestamp;
}
export interface CutLogsTable {
  id: Generated<string>;
  revision_id: string;
  shop_id: string;
  author_id: string | null;
  cut_on: ColumnType<Date, string, string>;
  material: string;
  bit_mm: number;
  machine_note: Generated<string>;
  device_key: string | null;
  clearance_mm: number | null;
  measured_width_mm: number | null;
  measured_length_mm: number | null;
  result: 'tight' | 'good' | 'loose';
  photo_key: string | null;
  /** The author's name from an imported archive, when they have no account in this shop (0006). */
  author_name: ColumnType<string | null, string | null | undefined, string | null>;
  created_at: Timestamp;
}
/** One completed shop-archive import (migration 0007). */
export interface ArchiveImportsTable {
  id: Generated<string>;
  shop_id: string;
  imported_by: string | null;
  imported_at: Timestamp;
  source_shop_id: string;
  source_shop_name: string;
  exported_at: ColumnType<Date, Date | string, Date | string>;
  /** sha256 (hex) of the archive's manifest.json bytes. */
  manifest_sha256: string;
  /** null for the first import of an archive into the shop; that import's id for a further copy. */
  copy_of: string | null;
  designs: number;
  revisions: number;
  files: number;
  cut_logs: number;
  photos: number;
  devices_added: number;
  devices_skipped: number;
  chargers_added: number;
  chargers_skipped: number;
  activity: number;
}

export interface RateLimitsTable {
  /** `<limiter>:<client key>`, e.g. "sign-in-per-account:account:wren@birchfold.example". */
  key: string;
  hits: number;
  reset_at: Date;
}

export interface Database {
  users: UsersTable;
  sessions: SessionsTable;
  shops: ShopsTable;
  memberships: MembershipsTable;
  invites: InvitesTable;
  password_resets: PasswordResetsTable;
  designs: DesignsTable;
  revisions: RevisionsTable;
  revision_files: RevisionFilesTable;
  activity: ActivityTable;
  devices: DevicesTable;
  chargers: ChargersTable;
  cut_logs: CutLogsTable;
  archive_imports: ArchiveImportsTable;
  rate_limits: RateLimitsTable;
}

export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type Shop = Selectable<ShopsTable>;
export type Design = Selectable<DesignsTable>;
export type Revision = Selectable<RevisionsTable>;
