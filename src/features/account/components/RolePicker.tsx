import { ROLE_NAMES, type RoleName, type UserDto } from '../../../../shared/protocol';
import { useChangeRole } from '../api/admin';

/** One person's role, changed on the spot; one's own is shown but cannot be changed here. */
export function RolePicker({ user, isSelf }: { user: UserDto; isSelf: boolean }) {
  const change = useChangeRole();
  return (
    <div className="flex flex-col gap-1">
      <label className="sr-only" htmlFor={`role-${user.id}`}>
        Role of {user.displayName}
      </label>
      <select
        id={`role-${user.id}`}
        value={user.role}
        disabled={change.isPending || isSelf}
        onChange={(e) => change.mutate({ id: user.id, role: e.target.value as RoleName })}
        className="min-h-12 rounded-lg border-2 border-line bg-card px-3"
      >
        {ROLE_NAMES.map((role) => (
          <option key={role} value={role}>
            {role}
          </option>
        ))}
      </select>
      {change.error && (
        <p role="alert" className="text-danger">
          {change.error.message}
        </p>
      )}
    </div>
  );
}
