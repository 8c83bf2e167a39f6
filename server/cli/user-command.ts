/**
 * `drydig user add NAME [--role admin|designer|viewer] | list | disable NAME | enable NAME | reset NAME`
 * on the data folder's database (also while the service runs). `add` and `reset` print a new random
 * password once; only its argon2 hash is stored. Disabling or resetting ends the user's sessions.
 */
import { DrydigError } from '../../shared/schema';
import { generatePassword, hashPassword } from '../auth';
import { openScenarioStore, ROLES, type Role } from '../storage';
import type { CliCommand } from './cli-io';
import { resolveDataDir } from './data-dir-option';
import { parseOptions, usageError } from './parse-options';

export const USER_HELP = `drydig user — accounts of the service

  drydig user add NAME [--role designer]   make an account (roles: ${ROLES.join(', ')}); prints its password once
  drydig user list                         accounts, roles, disabled or not
  drydig user disable NAME                 the account can no longer sign in; its sessions end
  drydig user enable NAME                  undoes disable
  drydig user reset NAME                   a new password (printed once); its sessions end

  --data DIR   data folder (default DRYDIG_DATA, else ./data)
`;

const NAME_RE = /^[A-Za-z0-9._@-]{1,64}$/;

export const runUserCommand: CliCommand = async (args, io) => {
  const { positionals, values } = parseOptions(args, { role: 'value', data: 'value', help: 'flag' }, 'user');
  const [action, name, extra] = positionals;
  if (values.help === 'true' || action === undefined) {
    (action === undefined && values.help !== 'true' ? io.stderr : io.stdout)(USER_HELP);
    return action === undefined && values.help !== 'true' ? 2 : 0;
  }
  if (extra !== undefined) throw usageError(`user: unexpected argument ${extra}`);
  const needsName = action !== 'list';
  if (needsName && (name === undefined || !NAME_RE.test(name))) throw usageError(`user ${action}: give a user name of 1–64 letters, digits or . _ @ -`);
  const store = openScenarioStore(resolveDataDir(values.data, io.cwd));
  try {
    const accounts = store.accounts;
    switch (action) {
      case 'add': {
        const role = (values.role ?? 'designer') as Role;
        if (!ROLES.includes(role)) throw usageError(`--role: "${role}" is not one of ${ROLES.join(', ')}`);
        if (accounts.findUser(name!)) throw new DrydigError('DRYDIG_ERR_CLI_USAGE', `user add: an account "${name}" exists already (drydig user reset ${name} gives it a new password)`);
        const password = generatePassword();
        accounts.addUser({ username: name!, role, passwordHash: await hashPassword(password) });
        accounts.appendAudit({ actor: 'command line', action: 'account-made', scenarioId: null, revision: null, detail: `${name} (${role})` });
        io.stdout(`account ${name} (${role}) made; its password, shown only now: ${password}\n`);
        return 0;
      }
      case 'list': {
        const users = accounts.listUsers();
        if (users.length === 0) io.stdout('no accounts yet (drydig user add NAME --role admin, or the setup link the service prints at start)\n');
        for (const u of users) io.stdout(`${u.username}\t${u.role}\t${u.disabledAt ? `disabled ${u.disabledAt}` : 'active'}\tsince ${u.createdAt}\n`);
        return 0;
      }
      case 'disable':
      case 'enable': {
        if (!accounts.setDisabled(name!, action === 'disable')) throw new DrydigError('DRYDIG_ERR_CLI_USAGE', `user ${action}: no account "${name}"`);
        accounts.appendAudit({ actor: 'command line', action: `account-${action}d`, scenarioId: null, revision: null, detail: name! });
        io.stdout(`account ${name} ${action}d\n`);
        return 0;
      }
      case 'reset': {
        const password = generatePassword();
        if (!accounts.setPasswordHash(name!, await hashPassword(password))) throw new DrydigError('DRYDIG_ERR_CLI_USAGE', `user reset: no account "${name}"`);
        accounts.appendAudit({ actor: 'command line', action: 'password-reset', scenarioId: null, revision: null, detail: name! });
        io.stdout(`account ${name}: new password, shown only now: ${password}\n`);
        return 0;
      }
      default:
        throw usageError(`user: unknown action "${action.slice(0, 40)}" (add, list, disable, enable, reset)`);
    }
  } finally {
    await store.close();
  }
};
