// Accounts, shops and roles: one schema per payload, used by the API routes and by the forms.
import { z } from 'zod';

export const ROLES = ['owner', 'editor', 'viewer'] as const;
export const Role = z.enum(ROLES, { error: 'Choose a role: owner, editor or viewer' });
export type Role = z.infer<typeof Role>;

export const ROLE_LABEL: Record<Role, string> = { owner: 'Owner', editor: 'Editor', viewer: 'Viewer' };
export const ROLE_WITH_ARTICLE: Record<Role, string> = { owner: 'an owner', editor: 'an editor', viewer: 'a viewer' };

/** What each role can do, in our own words, to follow "can": "A viewer can browse…". */
export const ROLE_HELP: Record<Role, string> = {
  owner: 'invite people, change roles and rename the shop, besides everything an editor does',
  editor: 'add designs and save new revisions, besides everything a viewer does',
  viewer: 'browse the library and download cut files',
};

/** Sent by the web app with every request; the API requires it on cookie-signed changes (CSRF). */
export const CSRF_HEADER = 'X-Jigwright-CSRF';

export const PASSWORD_MIN = 10;
// bcrypt reads at most 72 bytes of a password and silently ignores the rest (from memory:
// OWASP Password Storage Cheat Sheet, bcrypt section), so longer ones are refused, not cut.
export const PASSWORD_MAX_BYTES = 72;

/** A strict object whose unknown-field and wrong-type messages read as plain sentences. */
function strict<T extends z.core.$ZodLooseShape>(shape: T) {
  return z.strictObject(shape, {
    error: (issue) => {
      if (issue.code === 'unrecognized_keys') {
        const keys = (issue as { keys: string[] }).keys;
        return `Unknown field${keys.length > 1 ? 's' : ''}: ${keys.join(', ')}`;
      }
      if (issue.code === 'invalid_type') return 'Send the fields as a JSON object';
      return undefined;
    },
  });
}

export const Email = z
  .string({ error: 'Enter your e-mail address' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter your e-mail address')
  .max(254, 'An e-mail address has at most 254 characters')
  .pipe(z.email({ error: 'Enter a full e-mail address, like name@shop.example' }));

export const NewPassword = z
  .string({ error: 'Choose a password' })
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
  .refine((p) => new TextEncoder().encode(p).byteLength <= PASSWORD_MAX_BYTES, `Use at most ${PASSWORD_MAX_BYTES} bytes (about ${PASSWORD_MAX_BYTES} plain letters)`);

/** Any password already set: only its presence is checked, the server compares it. */
const GivenPassword = z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(200, 'That password is too long');

// Names go into mail subjects and headers: no line breaks or other control characters.
const NO_CONTROL_CHARACTERS = /^[^\p{Cc}]*$/u;

const PersonName = z
  .string({ error: 'Enter your name' })
  .trim()
  .min(1, 'Enter your name')
  .max(80, 'A name has at most 80 characters')
  .regex(NO_CONTROL_CHARACTERS, 'A name cannot contain line breaks or control characters');

export const ShopName = z
  .string({ error: 'Name the shop' })
  .trim()
  .min(2, 'A shop name needs at least 2 characters')
  .max(80, 'A shop name has at most 80 characters')
  .regex(NO_CONTROL_CHARACTERS, 'A shop name cannot contain line breaks or control characters');

export const SignUp = strict({ email: Email, password: NewPassword, name: PersonName });
export type SignUp = z.input<typeof SignUp>;

export const SignIn = strict({ email: Email, password: GivenPassword });
export type SignIn = z.input<typeof SignIn>;

export const ChangePassword = strict({ currentPassword: GivenPassword, newPassword: NewPassword }).refine(
  (v) => v.currentPassword !== v.newPassword,
  { message: 'The new password must differ from the current one', path: ['newPassword'] },
);
export type ChangePassword = z.input<typeof ChangePassword>;

export const RequestReset = strict({ email: Email });
export type RequestReset = z.input<typeof RequestReset>;

/** Tokens are 32 random bytes in base64url (43 characters). */
export const LinkToken = z
  .string({ error: 'The link is missing its code' })
  .regex(/^[A-Za-z0-9_-]{43}$/, 'This link is not complete; open it again from the e-mail');

export const ResetPassword = strict({ token: LinkToken, password: NewPassword });
export type ResetPassword = z.input<typeof ResetPassword>;

export const CreateShop = strict({ name: ShopName });
export type CreateShop = z.input<typeof CreateShop>;
export const RenameShop = CreateShop;
export type RenameShop = CreateShop;

export const CreateInvite = strict({ email: Email, role: Role });
export type CreateInvite = z.input<typeof CreateInvite>;

export const ChangeRole = strict({ role: Role });
export type ChangeRole = z.input<typeof ChangeRole>;

// Response shapes (what the API returns; the client reads the same types).
export interface PublicUser {
  id: string;
  email: string;
  name: string;
  units: 'mm' | 'in';
}
export interface ShopSummary {
  id: string;
  name: string;
  slug: string;
  role: Role;
}
export interface Me {
  user: PublicUser;
  shops: ShopSummary[];
}
export interface SessionAnswer {
  token: string;
  user: PublicUser;
}
export interface Member {
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}
export interface PendingInvite {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
  invitedBy: string | null;
}
export interface InvitePreview {
  shopName: string;
  role: Role;
  email: string;
  expiresAt: string;
}
