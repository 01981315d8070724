import { Fragment, useMemo, useState } from 'react';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { permissionLabels, permissionsOf, roleLabels, roles, type Role } from '@shared/roles';
import type { AdminShop, AdminUser, AdminUserPatch, UserChange } from '@shared/schemas/admin';
import { ApiError } from '../../../lib/api-client';
import { Page } from '../../../components/ui/page';
import { Button } from '../../../components/ui/button';
import { Badge } from '../../../components/ui/badge';
import { inputClass } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/query-state';
import { useUsers } from '../api/get-users';
import { useShops } from '../api/get-shops';
import { useUserChanges } from '../api/get-user-changes';
import { useUpdateUser } from '../api/update-user';
import { useDebounced } from '../../../lib/use-debounced';
import { formatDateTime } from '@shared/dates';

const when = (iso: string | null) => (iso ? formatDateTime(iso) : 'never');

type Notice = { tone: 'ok' | 'error'; text: string } | null;

function describeError(err: unknown) {
  if (err instanceof ApiError) {
    const fields = Object.values(err.fields);
    return fields.length ? `${err.message} ${fields.join(' ')}` : err.message;
  }
  return err instanceof Error ? err.message : 'That did not work.';
}

const selectClass = `${inputClass} !w-auto min-w-[9rem] py-1.5 text-sm`;

const column = createColumnHelper<AdminUser>();

/** Users, their roles, shop links and suspension, with the record of every change. */
export default function AdminPage() {
  const [search, setSearch] = useState('');
  const q = useDebounced(search.trim(), 250);
  const users = useUsers(q);
  const shops = useShops();
  const update = useUpdateUser();
  const [notice, setNotice] = useState<Notice>(null);
  const [historyFor, setHistoryFor] = useState<number | null>(null);
  const [confirmSuspend, setConfirmSuspend] = useState<number | null>(null);
  // a role change waits for the admin to confirm it, having read what the role grants
  const [pendingRole, setPendingRole] = useState<{ userId: number; role: Role } | null>(null);

  const change = (user: AdminUser, patch: AdminUserPatch, done: string) => {
    setNotice(null);
    update.mutate(
      { userId: user.id, patch },
      {
        onSuccess: ({ sessionsEnded }) =>
          setNotice({
            tone: 'ok',
            text: sessionsEnded ? `${done} ${sessionsEnded} open session${sessionsEnded === 1 ? ' was' : 's were'} ended.` : done,
          }),
        onError: (err) => setNotice({ tone: 'error', text: `${user.login}: ${describeError(err)}` }),
      },
    );
  };

  const columns = useMemo(
    () => [
      column.display({
        id: 'person',
        header: 'Member',
        cell: ({ row: { original: u } }) => (
          <div className="min-w-[12rem]">
            <p className="font-bold text-ink">
              {u.name || u.login} {u.isYou && <span className="text-xs font-semibold text-graphite-soft">(you)</span>}
            </p>
            <p className="text-xs text-graphite-soft">
              @{u.login}
              {u.email ? ` · ${u.email}` : ''}
            </p>
          </div>
        ),
      }),
      column.accessor('role', {
        header: 'Role',
        cell: ({ row: { original: u } }) => (
          <select
            aria-label={`Role of ${u.login}`}
            className={selectClass}
            value={pendingRole?.userId === u.id ? pendingRole.role : u.role}
            disabled={u.isYou || update.isPending}
            title={u.isYou ? 'Another admin has to change your own role' : undefined}
            aria-controls={`role-confirm-${u.id}`}
            onChange={(e) => {
              const role = e.target.value as Role;
              setNotice(null);
              setPendingRole(role === u.role ? null : { userId: u.id, role });
            }}
          >
            {roles.map((r) => (
              <option key={r} value={r}>
                {roleLabels[r]}
              </option>
            ))}
          </select>
        ),
      }),
      column.display({
        id: 'shop',
        header: 'Shop',
        cell: ({ row: { original: u } }) =>
          u.role === 'shop' ? (
            <ShopSelect
              user={u}
              shops={shops.data?.shops ?? []}
              disabled={update.isPending}
              onPick={(shop) =>
                change(
                  u,
                  { shopId: shop?.id ?? null },
                  shop ? `${u.login} now speaks for ${shop.name}.` : `${u.login} is no longer linked to a shop.`,
                )
              }
            />
          ) : (
            <span className="text-xs text-graphite-soft">only for shop accounts</span>
          ),
      }),
      column.display({
        id: 'status',
        header: 'Status',
        cell: ({ row: { original: u } }) => (
          <div className="flex flex-wrap items-center gap-2">
            {u.suspended ? <Badge tone="oxide">Suspended</Badge> : <Badge tone="ink">Active</Badge>}
            {u.isYou ? null : u.suspended ? (
              <Button
                variant="secondary"
                className="!min-h-8 !px-3 !py-1"
                disabled={update.isPending}
                onClick={() => change(u, { suspended: false }, `${u.login} can sign in again.`)}
              >
                Restore
              </Button>
            ) : confirmSuspend === u.id ? (
              <>
                <Button
                  variant="danger"
                  className="!min-h-8 !px-3 !py-1"
                  disabled={update.isPending}
                  onClick={() => {
                    setConfirmSuspend(null);
                    change(u, { suspended: true }, `${u.login} is suspended and cannot sign in.`);
                  }}
                >
                  Yes, suspend
                </Button>
                <Button variant="quiet" className="!min-h-8 !px-3 !py-1" onClick={() => setConfirmSuspend(null)}>
                  Keep
                </Button>
              </>
            ) : (
              <Button variant="quiet" className="!min-h-8 !px-3 !py-1 !text-oxide" onClick={() => setConfirmSuspend(u.id)}>
                Suspend…
              </Button>
            )}
          </div>
        ),
      }),
      column.accessor('lastSignInAt', {
        header: 'Last sign-in',
        cell: (c) => <span className="tabular whitespace-nowrap text-sm">{when(c.getValue())}</span>,
      }),
      column.display({
        id: 'history',
        header: () => <span className="sr-only">History</span>,
        cell: ({ row: { original: u } }) => (
          <Button
            variant="quiet"
            className="!min-h-8 !px-3 !py-1"
            aria-expanded={historyFor === u.id}
            aria-controls={`history-${u.id}`}
            onClick={() => setHistoryFor((id) => (id === u.id ? null : u.id))}
          >
            {historyFor === u.id ? 'Hide history' : 'History'}
          </Button>
        ),
      }),
    ],
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [shops.data, update.isPending, historyFor, confirmSuspend, pendingRole],
  );

  const table = useReactTable({
    data: users.data?.users ?? [],
    columns,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (u) => String(u.id),
  });

  const accessError =
    users.error instanceof ApiError && (users.error.status === 401 || users.error.status === 403) ? users.error : null;

  return (
    <Page
      title="Admin"
      heading="Members and roles"
      lead="Change what each account may do, link shop accounts to their shop, and suspend accounts that misbehave. Every change is recorded with who made it."
    >
      <div className="mb-4 max-w-md">
        <label htmlFor="admin-search" className="mb-1 block text-sm font-bold">
          Find a member
        </label>
        <input
          id="admin-search"
          type="search"
          className={inputClass}
          placeholder="login or name"
          value={search}
          onChange={(e) => setSearch(e.target.value)}
          maxLength={80}
        />
      </div>

      <div aria-live="polite" className="min-h-6">
        {notice && (
          <p
            role={notice.tone === 'error' ? 'alert' : 'status'}
            className={`mb-4 rounded-md px-4 py-2 text-sm font-semibold ${notice.tone === 'error' ? 'bg-oxide-soft text-oxide' : 'bg-ink-faint text-ink'}`}
          >
            {notice.text}
          </p>
        )}
      </div>

      {accessError ? (
        <p role="alert" className="rounded-lg border border-oxide/40 bg-paper-card p-6">
          {accessError.status === 401
            ? 'Sign in with an admin account to manage members.'
            : 'Your account cannot manage members; that is for admins.'}
        </p>
      ) : users.isPending ? (
        <Loading label="Loading members…" />
      ) : users.error ? (
        <p role="alert" className="rounded-lg border border-oxide/40 bg-paper-card p-6 text-oxide">
          {describeError(users.error)}
        </p>
      ) : (
        <div className="relative overflow-x-auto rounded-lg border border-graphite/15 bg-paper-card">
          <table className="w-full border-collapse text-left text-sm">
            <caption className="sr-only">Members{q ? ` matching “${q}”` : ''}</caption>
            <thead className="bg-paper-deep text-xs uppercase tracking-wide text-graphite-soft">
              {table.getHeaderGroups().map((g) => (
                <tr key={g.id}>
                  {g.headers.map((h) => (
                    <th key={h.id} scope="col" className="px-3 py-2 font-bold">
                      {flexRender(h.column.columnDef.header, h.getContext())}
                    </th>
                  ))}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((row) => (
                <Fragment key={row.id}>
                  <tr className="border-t border-graphite/10 align-middle">
                    {row.getVisibleCells().map((cell) => (
                      <td key={cell.id} className="px-3 py-3">
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    ))}
                  </tr>
                  {pendingRole?.userId === row.original.id && (
                    <tr id={`role-confirm-${row.original.id}`} className="bg-brass-soft/30">
                      <td colSpan={row.getVisibleCells().length} className="px-3 py-3">
                        <RoleConfirm
                          user={row.original}
                          role={pendingRole.role}
                          busy={update.isPending}
                          onConfirm={() => {
                            const { role } = pendingRole;
                            setPendingRole(null);
                            change(row.original, { role }, `${row.original.login} is now ${roleLabels[role]}.`);
                          }}
                          onCancel={() => setPendingRole(null)}
                        />
                      </td>
                    </tr>
                  )}
                  {historyFor === row.original.id && (
                    <tr id={`history-${row.original.id}`} className="bg-paper">
                      <td colSpan={row.getVisibleCells().length} className="px-3 py-3">
                        <History userId={row.original.id} />
                      </td>
                    </tr>
                  )}
                </Fragment>
              ))}
              {table.getRowModel().rows.length === 0 && (
                <tr>
                  <td colSpan={columns.length} className="px-3 py-6 text-center text-graphite-soft">
                    {q ? `No member matches “${q}”.` : 'No members yet.'}
                  </td>
                </tr>
              )}
            </tbody>
          </table>
        </div>
      )}
    </Page>
  );
}

/** What the new role grants and what the member loses, before the change is made. */
function RoleConfirm({
  user,
  role,
  busy,
  onConfirm,
  onCancel,
}: {
  user: AdminUser;
  role: Role;
  busy: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const now = permissionsOf(user.role);
  const next = permissionsOf(role);
  const lost = now.filter((p) => !next.includes(p));
  return (
    <div role="group" aria-label={`Confirm the role of ${user.login}`} className="max-w-3xl space-y-2" data-testid="role-confirm">
      <p className="font-bold text-graphite">
        Make {user.name || user.login} (@{user.login}) {roleLabels[role].toLowerCase() === 'admin' ? 'an' : 'a'}{' '}
        {roleLabels[role]} instead of {roleLabels[user.role]}?
      </p>
      <p className="text-sm text-graphite">As {roleLabels[role]} they may:</p>
      <ul className="list-disc pl-5 text-sm text-graphite">
        {next.map((p) => (
          <li key={p}>{permissionLabels[p]}</li>
        ))}
      </ul>
      {lost.length > 0 && (
        <p className="text-sm text-oxide">They may no longer: {lost.map((p) => permissionLabels[p]).join('; ')}.</p>
      )}
      <p className="text-xs text-graphite-soft">It applies on their next request and is recorded with your name.</p>
      <div className="flex flex-wrap gap-2">
        <Button className="!min-h-8 !px-3 !py-1" onClick={onConfirm} disabled={busy}>
          Yes, make them {roleLabels[role]}
        </Button>
        <Button variant="quiet" className="!min-h-8 !px-3 !py-1" onClick={onCancel}>
          Keep {roleLabels[user.role]}
        </Button>
      </div>
    </div>
  );
}

function ShopSelect({
  user,
  shops,
  disabled,
  onPick,
}: {
  user: AdminUser;
  shops: AdminShop[];
  disabled: boolean;
  onPick: (shop: AdminShop | null) => void;
}) {
  return (
    <select
      aria-label={`Shop of ${user.login}`}
      className={selectClass}
      value={user.shop?.id ?? ''}
      disabled={disabled}
      onChange={(e) => onPick(shops.find((s) => String(s.id) === e.target.value) ?? null)}
    >
      <option value="">No shop yet</option>
      {shops.map((s) => (
        <option key={s.id} value={s.id}>
          {s.name}
        </option>
      ))}
    </select>
  );
}

function changeValue(c: UserChange, value: string | null) {
  if (c.field === 'role') return value ? (roleLabels[value as Role] ?? value) : '—';
  if (c.field === 'suspended') return value === 'true' ? 'Suspended' : 'Active';
  return value ?? 'no shop';
}

const fieldLabels: Record<UserChange['field'], string> = { role: 'Role', shop: 'Shop', suspended: 'Status' };

function History({ userId }: { userId: number }) {
  const { data, isPending, error } = useUserChanges(userId);
  if (isPending) return <Loading label="Loading history…" />;
  if (error)
    return (
      <p role="alert" className="text-oxide">
        {describeError(error)}
      </p>
    );
  if (data.changes.length === 0) return <p className="text-graphite-soft">No changes recorded yet.</p>;
  return (
    <ol className="space-y-1">
      {data.changes.map((c) => (
        <li key={c.id} className="flex flex-wrap gap-x-2 text-sm">
          <time dateTime={c.at} className="tabular text-graphite-soft">
            {when(c.at)}
          </time>
          <span>
            <b>{fieldLabels[c.field]}:</b> {changeValue(c, c.from)} → {changeValue(c, c.to)}
          </span>
          <span className="text-graphite-soft">by {c.actor ? `${c.actor.name} (@${c.actor.login})` : 'the server shell'}</span>
        </li>
      ))}
    </ol>
  );
}
