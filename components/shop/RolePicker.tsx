import { ROLE_LABEL, ROLES, type Role } from '../../shared/schemas/auth';
import { Segmented } from '../forms/Segmented';

const OPTIONS = ROLES.map((r) => ({ value: r, label: ROLE_LABEL[r] }));

export function RolePicker({ value, onChange, label, disabled, invalid }: { value: Role | undefined; onChange: (r: Role) => void; label: string; disabled?: boolean; invalid?: boolean }) {
  return <Segmented label={label} options={OPTIONS} value={value} onChange={onChange} disabled={disabled} invalid={invalid} />;
}
