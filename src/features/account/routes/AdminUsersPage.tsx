import { useAdminUsers } from '../api/admin';
import { RolePicker } from '../components/RolePicker';
import { useMe } from '../../../lib/api/auth';
import { Card } from '../../../components/ui/Card';
import { FormMessage } from '../../../components/ui/FormMessage';
import { SignInFirst } from '../../../components/ui/SignInFirst';

export function AdminUsersPage() {
  const { data: me, isPending } = useMe();
  const isAdmin = me?.role === 'admin';
  const users = useAdminUsers(isAdmin);
  if (isPending) return <p role="status">Loading…</p>;
  if (!me) return <SignInFirst />;
  if (!isAdmin) {
    return (
      <Card className="mx-auto max-w-lg">
        <h1 className="mb-3 text-title font-semibold">Only organisers can see this page</h1>
        <p>People and roles are managed by an admin. Ask your club organiser if you need the teacher role.</p>
      </Card>
    );
  }
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-title font-semibold">People and roles</h1>
      {users.error && <FormMessage error>{users.error.message}</FormMessage>}
      <Card className="overflow-x-auto p-0">
        <table className="w-full text-left">
          <caption className="sr-only">Everyone with a Rackside account</caption>
          <thead className="border-b-2 border-line/60">
            <tr>
              <th scope="col" className="px-4 py-3">Name</th>
              <th scope="col" className="px-4 py-3">E-mail</th>
              <th scope="col" className="px-4 py-3">Role</th>
            </tr>
          </thead>
          <tbody>
            {users.data?.map((user) => (
              <tr key={user.id} className="border-b border-line/30">
                <td className="px-4 py-3 font-medium">{user.displayName}</td>
                <td className="px-4 py-3 break-all">{user.email}</td>
                <td className="px-4 py-3">
                  <RolePicker user={user} isSelf={user.id === me.id} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </Card>
    </div>
  );
}
