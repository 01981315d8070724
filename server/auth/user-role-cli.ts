import { openDb, migrateDb, closeDb } from '../db/client';
import { systemClock } from '../lib/clock';
import { AppError } from '../lib/app-error';
import { roleLabels, roleSchema, roles } from '../../shared/roles';
import { setRoleByLogin } from '../features/admin/admin.service';
import { endAllSessions } from './session-store';

/** `npm run user:role -- <login> <role>`: sets a role from the shell (the first admin of a deployment). */
function main(argv: string[]): number {
  const [login, roleArg, ...rest] = argv;
  if (!login || !roleArg || rest.length) {
    console.error(`Usage: npm run user:role -- <login> <role>\n  role is one of: ${roles.join(', ')}`);
    return 2;
  }
  const role = roleSchema.safeParse(roleArg);
  if (!role.success) {
    console.error(`"${roleArg}" is not a role. Use one of: ${roles.join(', ')}.`);
    return 2;
  }
  const file = process.env.DATABASE_URL || './data/swapyard.db';
  const db = openDb(file);
  try {
    migrateDb(db);
    const { user, changed, sessionsEnded } = setRoleByLogin(
      { db, clock: systemClock, endSessions: (userId) => endAllSessions(db, userId) },
      login,
      role.data,
    );
    const ended = sessionsEnded
      ? ` Their ${sessionsEnded} open session${sessionsEnded === 1 ? ' was' : 's were'} ended; they sign in again.`
      : ' The change applies on their next request.';
    console.log(
      changed
        ? `${user.login} (id ${user.id}) is now ${roleLabels[user.role]}.${ended}`
        : `${user.login} (id ${user.id}) already is ${roleLabels[user.role]}; nothing changed.`,
    );
    return 0;
  } catch (err) {
    if (err instanceof AppError) {
      console.error(
        err.code === 'not_found' ? `No user has the login "${login}" in ${file}. They need to sign in once first.` : err.message,
      );
      return 1;
    }
    throw err;
  } finally {
    closeDb(db);
  }
}

process.exitCode = main(process.argv.slice(2));
