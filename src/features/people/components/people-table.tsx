import { ROLE_LABELS, ROLES, type Role } from '@shared/auth/roles';
import { Button } from '@/components/ui/button';
import { useMe } from '@/lib/auth';
import { type Person, useUpdatePerson } from '../api/people';

export function PeopleTable({ people }: { people: Person[] }) {
  const update = useUpdatePerson();
  const me = useMe().data;
  const toggleRole = (p: Person, role: Role) => {
    const roles = p.roles.includes(role) ? p.roles.filter((r) => r !== role) : [...p.roles, role];
    if (roles.length) update.mutate({ id: p.id, roles });
  };
  return (
    <div className="overflow-x-auto">
      {update.isError && (
        <p role="alert" className="mb-3 rounded-md bg-changes-soft px-3 py-2 text-sm text-changes">
          {update.error.message}
        </p>
      )}
      <table className="w-full text-left text-sm">
        <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
          <tr>
            <th className="py-2 pr-4">Person</th>
            {ROLES.map((r) => (
              <th key={r} className="px-2 py-2 text-center">
                {ROLE_LABELS[r]}
              </th>
            ))}
            <th className="px-2 py-2">Status</th>
            <th className="py-2" />
          </tr>
        </thead>
        <tbody>
          {people.map((p) => (
            <tr key={p.id} className={`border-b border-rule/60 ${p.active ? '' : 'text-ink-faint'}`}>
              <td className="py-2.5 pr-4">
                <div className="font-semibold">{p.name}</div>
                <div className="text-xs text-ink-faint">{p.email}</div>
              </td>
              {ROLES.map((r) => (
                <td key={r} className="px-2 text-center">
                  <input
                    type="checkbox"
                    className="accent-copper"
                    aria-label={`${ROLE_LABELS[r]} role for ${p.name}`}
                    checked={p.roles.includes(r)}
                    disabled={update.isPending || (p.roles.length === 1 && p.roles.includes(r))}
                    onChange={() => toggleRole(p, r)}
                  />
                </td>
              ))}
              <td className="px-2">{p.active ? 'Active' : 'Deactivated'}</td>
              <td className="py-2 text-right">
                {p.id !== me?.id && (
                  <Button
                    variant={p.active ? 'danger' : 'secondary'}
                    onClick={() => update.mutate({ id: p.id, active: !p.active })}
                    disabled={update.isPending}
                  >
                    {p.active ? 'Deactivate' : 'Reactivate'}
                  </Button>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
