/**
 * The first-start setup link: with no accounts, the service makes a one-time token (256 bits,
 * only its hash stored) and prints `<url>/#setup=<token>` on the console. The link makes the first
 * admin account and then never works again. There is no default password.
 */
import { createShareToken, hashShareToken, type ScenarioStore } from '../storage';

/** A new setup token when no account exists (replacing an unused one), else undefined. */
export function issueSetupToken(store: ScenarioStore): string | undefined {
  if (store.accounts.countUsers() > 0) return undefined;
  const token = createShareToken();
  store.accounts.putSetupToken(hashShareToken(token));
  return token;
}

export function setupLinkText(url: string, token: string): string {
  return `drydig: no accounts yet. Open this one-time link to make the first admin account (it works once):\n  ${url}/#setup=${token}\n`;
}
