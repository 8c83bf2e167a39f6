/**
 * The service as a separate process for the reliability tests: `node --import tsx
 * tests/reliability/reliability-server.ts DATA_DIR`. Listens on 127.0.0.1 and a random port, writes
 * `LISTENING <port>` on stdout, and keeps the write limit high so bursts test storage, not limits.
 */
import { buildApp } from '../../server/app';
import { hashPassword } from '../../server/auth';
import { RELIABILITY_USER } from './reliability-harness';

const dataDir = process.argv[2];
if (!dataDir) {
  process.stderr.write('usage: reliability-server.ts DATA_DIR\n');
  process.exit(2);
}
const app = await buildApp({ dataDir, clientDir: false, security: { writeMax: 1_000_000 } });
// The storage routes need an account: the harness signs in with this one.
// Several processes may share one data folder and start at once: the account may appear between the
// look-up and the insert (made by a sibling process), which is as good as making it here.
if (!app.scenarioStore.accounts.findUser(RELIABILITY_USER.username)) {
  const passwordHash = await hashPassword(RELIABILITY_USER.password);
  try {
    app.scenarioStore.accounts.addUser({ username: RELIABILITY_USER.username, role: 'designer', passwordHash });
  } catch (error) {
    if (!app.scenarioStore.accounts.findUser(RELIABILITY_USER.username)) throw error;
  }
}
await app.listen({ host: '127.0.0.1', port: 0 });
const address = app.server.address();
process.stdout.write(`LISTENING ${typeof address === 'object' && address ? address.port : 0}\n`);
