/**
 * <scenario-store-panel>: saving, history, restore, share links and exports of the scenario being
 * edited, against `/api/v1/scenarios`. Property `scenario` is the editor's current document; the
 * panel fires `scenario-loaded` (detail: the scenario) when the user opens a stored one, a past
 * revision, or the newer revision after a conflict.
 *
 * Concurrency: every save names the revision it was based on. When someone (or another tab) saved
 * first the server answers 409 with the newer revision; the panel shows both and lets the user
 * load theirs, save theirs-then-mine on top (a new revision; nothing is lost, the history keeps
 * both), or download their own copy. A quiet poll shows a "newer revision exists" notice before
 * the user even tries to save.
 */
import { LitElement, css, html, nothing } from 'lit';
import type { Scenario } from '../../shared/schema';
import { describeErrorPlainly } from '../../shared/schema/plain-error';

interface RevisionMeta { scenarioId: string; revision: number; savedAt: string; savedBy: string; note: string; summary: string; name: string; restoredFrom: number | null }
interface Listing { scenarioId: string; name: string; latestRevision: number; latestSavedAt: string; latestSavedBy: string }
interface LinkInfo { linkId: string; mode: 'view' | 'edit'; revision: number | null; label: string; createdAt: string; revokedAt: string | null }
interface Account { username: string; role: 'admin' | 'designer' | 'viewer' }
interface AuditEntry { auditId: number; at: string; actor: string; action: string; revision: number | null; detail: string }
/** Pages of a list followed at most (the server pages lists, newest first). */
const MAX_PAGES = 20;
interface ErrorBody { error?: { code: string; message: string; fix: string }; latest?: RevisionMeta & { scenario: Scenario } }

/** How often the panel checks for a newer revision while a stored scenario is open, ms. */
export const NEWER_REVISION_POLL_MS = 20_000;

export class ScenarioStorePanel extends LitElement {
  static override properties = {
    scenario: { attribute: false },
    apiBase: { type: String, attribute: 'api-base' },
    scenarioId: { state: true },
    revision: { state: true },
    shownRevision: { state: true },
    savedJson: { state: true },
    savedBy: { state: true },
    message: { state: true },
    conflict: { state: true },
    newer: { state: true },
    listing: { state: true },
    history: { state: true },
    links: { state: true },
    newLink: { state: true },
    busy: { state: true },
    account: { state: true },
    setupOpen: { state: true },
    audit: { state: true },
  };
  declare scenario: Scenario | null;
  declare apiBase: string;
  declare scenarioId: string | null;
  /** The revision new saves are based on (the latest the panel knows). */
  declare revision: number | null;
  /** The revision whose content is in the editor (exports and pinned links use it). */
  declare shownRevision: number | null;
  declare savedJson: string;
  declare savedBy: string;
  declare message: string;
  declare conflict: (RevisionMeta & { scenario: Scenario }) | null;
  declare newer: RevisionMeta | null;
  declare listing: Listing[] | null;
  declare history: RevisionMeta[] | null;
  declare links: LinkInfo[] | null;
  declare newLink: { url: string; mode: string } | null;
  declare busy: boolean;
  /** The signed-in account, or null (the sign-in screen shows). */
  declare account: Account | null;
  /** No account exists yet and the page was opened with the one-time setup link. */
  declare setupOpen: boolean;
  declare audit: AuditEntry[] | null;
  private csrf = '';
  private setupToken = '';
  private pollTimer: ReturnType<typeof setInterval> | null = null;

  static override styles = css`
    :host { display: block; font: 14px/1.4 system-ui, sans-serif; color: #111; }
    section { border-top: 1px solid #d5dbe1; padding: 0.5rem 0; }
    h3 { font-size: 0.95rem; margin: 0.2rem 0 0.4rem; }
    .row { display: flex; flex-wrap: wrap; gap: 0.4rem; align-items: center; margin: 0.3rem 0; }
    input, select, button { font: inherit; min-height: 2rem; }
    button { border: 1px solid #124; background: #124; color: #fff; border-radius: 4px; padding: 0 0.7rem; cursor: pointer; }
    button.secondary { background: #fff; color: #124; }
    button[disabled] { opacity: 0.5; cursor: default; }
    .status { font-size: 0.85rem; color: #333; }
    .dirty { color: #a60; font-weight: 600; }
    .conflict, .newer { border: 2px solid #c60; background: #fff4e0; border-radius: 6px; padding: 0.5rem; margin: 0.4rem 0; }
    .error { color: #a00; }
    table { border-collapse: collapse; width: 100%; font-size: 0.82rem; }
    td, th { border-bottom: 1px solid #e1e5ea; padding: 0.2rem 0.3rem; text-align: left; vertical-align: top; }
    code { word-break: break-all; background: #f1f3f5; padding: 0.1rem 0.2rem; }
    a { color: #124; }
  `;

  constructor() {
    super();
    this.scenario = null;
    this.apiBase = '/api/v1';
    this.scenarioId = null;
    this.revision = null;
    this.shownRevision = null;
    this.savedJson = '';
    this.savedBy = '';
    this.message = '';
    this.conflict = null;
    this.newer = null;
    this.listing = null;
    this.history = null;
    this.links = null;
    this.newLink = null;
    this.busy = false;
    this.account = null;
    this.setupOpen = false;
    this.audit = null;
  }

  override connectedCallback(): void {
    super.connectedCallback();
    this.pollTimer = setInterval(() => void this.checkForNewer(), NEWER_REVISION_POLL_MS);
    const setup = /#setup=([A-Za-z0-9_-]{43})/.exec(globalThis.location?.hash ?? '');
    if (setup) this.setupToken = setup[1]!;
    void this.loadSession();
  }

  private async loadSession(): Promise<void> {
    const res = await fetch(`${this.apiBase}/auth/session`);
    const body = (await res.json().catch(() => ({}))) as { user?: Account; csrfToken?: string; setupOpen?: boolean };
    this.account = res.ok && body.user ? body.user : null;
    this.csrf = body.csrfToken ?? '';
    this.setupOpen = !res.ok && body.setupOpen === true && this.setupToken !== '';
  }

  private async signIn(event: Event): Promise<void> {
    event.preventDefault();
    const form = event.target as HTMLFormElement;
    const field = (name: string) => (form.elements.namedItem(name) as HTMLInputElement).value;
    const setup = this.setupOpen;
    const res = await fetch(`${this.apiBase}/auth/${setup ? 'setup' : 'login'}`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(setup ? { token: this.setupToken, username: field('username'), password: field('password') } : { username: field('username'), password: field('password') }),
    });
    const body = (await res.json().catch(() => ({}))) as { user?: Account; csrfToken?: string } & ErrorBody;
    if (!res.ok || !body.user) {
      this.message = this.describeError(body, 'Sign-in failed.');
      return;
    }
    if (setup) history.replaceState(null, '', location.pathname + location.search);
    this.setupOpen = false;
    this.account = body.user;
    this.csrf = body.csrfToken ?? '';
    this.message = '';
  }

  private async signOut(): Promise<void> {
    await fetch(`${this.apiBase}/auth/logout`, { method: 'POST', headers: { 'x-drydig-csrf': this.csrf } });
    this.account = null;
    this.csrf = '';
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    if (this.pollTimer !== null) clearInterval(this.pollTimer);
    this.pollTimer = null;
  }

  private get dirty(): boolean {
    return this.scenario !== null && JSON.stringify(this.scenario) !== this.savedJson;
  }

  private async call<T>(method: string, path: string, body?: unknown): Promise<{ ok: true; data: T } | { ok: false; status: number; body: ErrorBody }> {
    const headers: Record<string, string> = body === undefined ? {} : { 'content-type': 'application/json' };
    if (method !== 'GET') headers['x-drydig-csrf'] = this.csrf;
    const res = await fetch(`${this.apiBase}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    if (res.status === 401) this.account = null;
    const text = await res.text();
    const parsed = text ? (JSON.parse(text) as unknown) : null;
    return res.ok ? { ok: true, data: parsed as T } : { ok: false, status: res.status, body: (parsed ?? {}) as ErrorBody };
  }

  private describeError(body: ErrorBody, fallback: string): string {
    return body.error ? describeErrorPlainly(body.error) : fallback;
  }

  /**
   * The editor now holds a document that did not come from the store (a demo, a local file): the
   * panel lets go of the stored scenario, so the next save stores it anew instead of writing a
   * revision of something else.
   */
  detach(): void {
    this.scenarioId = null;
    this.revision = null;
    this.shownRevision = null;
    this.savedJson = '';
    this.conflict = null;
    this.newer = null;
    this.history = null;
    this.links = null;
    this.newLink = null;
    this.message = '';
  }

  private loaded(scenario: Scenario, scenarioId: string, revision: number, latestRevision = revision): void {
    this.scenarioId = scenarioId;
    // Saving an opened past revision builds on the latest one, so it can never be refused as stale.
    this.revision = latestRevision;
    this.shownRevision = revision;
    this.savedJson = JSON.stringify(scenario);
    this.conflict = null;
    this.newer = null;
    this.dispatchEvent(new CustomEvent('scenario-loaded', { detail: scenario, bubbles: true, composed: true }));
  }

  private async save(overBase?: number): Promise<void> {
    if (!this.scenario) return;
    const note = (this.renderRoot.querySelector('input[name="note"]') as HTMLInputElement | null)?.value ?? '';
    this.busy = true;
    try {
      const body = { scenario: this.scenario, savedBy: this.savedBy, note };
      const res = this.scenarioId === null
        ? await this.call<RevisionMeta>('POST', '/scenarios', body)
        : await this.call<RevisionMeta>('PUT', `/scenarios/${this.scenarioId}`, { ...body, baseRevision: overBase ?? this.revision });
      if (res.ok) {
        this.scenarioId = res.data.scenarioId;
        this.revision = res.data.revision;
        this.shownRevision = res.data.revision;
        this.savedJson = JSON.stringify(this.scenario);
        this.conflict = null;
        this.newer = null;
        this.message = `Saved as revision ${res.data.revision}: ${res.data.summary}`;
        if (this.history) await this.loadHistory();
      } else if (res.status === 409 && res.body.latest) {
        this.conflict = res.body.latest;
        this.message = '';
      } else {
        this.message = this.describeError(res.body, `Not saved (${res.status}).`);
      }
    } catch {
      this.message = 'Not saved: the server cannot be reached. Your edits are still here; download a copy to be safe.';
    } finally {
      this.busy = false;
    }
  }

  private async checkForNewer(): Promise<void> {
    if (this.scenarioId === null || this.revision === null || this.busy) return;
    try {
      const res = await this.call<RevisionMeta>('GET', `/scenarios/${this.scenarioId}/revisions`);
      if (!res.ok) return;
      const latest = (res.data as unknown as { revisions: RevisionMeta[] }).revisions[0];
      this.newer = latest && latest.revision > this.revision ? latest : null;
    } catch {
      // Offline for a moment: try again at the next tick.
    }
  }

  private download(scenario: Scenario, suffix: string): void {
    const blob = new Blob([`${JSON.stringify(scenario, null, 2)}\n`], { type: 'application/json' });
    const a = document.createElement('a');
    a.href = URL.createObjectURL(blob);
    a.download = `${(scenario.name || 'scenario').replace(/[^A-Za-z0-9]+/g, '-').toLowerCase()}-${suffix}.drydig.json`;
    a.click();
    setTimeout(() => URL.revokeObjectURL(a.href), 10_000);
  }

  private async loadListing(): Promise<void> {
    const all: Listing[] = [];
    let cursor: string | null = null;
    for (let page = 0; page < MAX_PAGES; page++) {
      const res: Awaited<ReturnType<typeof this.call<{ scenarios: Listing[]; nextCursor: string | null }>>> = await this.call<{ scenarios: Listing[]; nextCursor: string | null }>('GET', `/scenarios${cursor ? `?cursor=${encodeURIComponent(cursor)}` : ''}`);
      if (!res.ok) {
        this.message = this.describeError(res.body, 'Could not list stored scenarios.');
        break;
      }
      all.push(...res.data.scenarios);
      cursor = res.data.nextCursor;
      if (!cursor) break;
    }
    this.listing = all;
  }

  private async open(scenarioId: string, revision?: number): Promise<void> {
    const path = revision === undefined ? `/scenarios/${scenarioId}` : `/scenarios/${scenarioId}/revisions/${revision}`;
    const res = await this.call<RevisionMeta & { scenario: Scenario }>('GET', path);
    if (!res.ok) {
      this.message = this.describeError(res.body, 'Could not open it.');
      return;
    }
    const latest = revision === undefined ? res.data.revision : (this.history?.[0]?.revision ?? res.data.revision);
    this.loaded(res.data.scenario, scenarioId, res.data.revision, latest);
    this.message = `Opened revision ${res.data.revision} of "${res.data.name}".`;
    await this.loadHistory();
  }

  private async loadHistory(): Promise<void> {
    if (this.scenarioId === null) return;
    const all: RevisionMeta[] = [];
    let cursor: string | null = null;
    for (let page = 0; page < MAX_PAGES; page++) {
      const res: Awaited<ReturnType<typeof this.call<{ revisions: RevisionMeta[]; nextCursor: string | null }>>> = await this.call<{ revisions: RevisionMeta[]; nextCursor: string | null }>('GET', `/scenarios/${this.scenarioId}/revisions${cursor ? `?cursor=${cursor}` : ''}`);
      if (!res.ok) break;
      all.push(...res.data.revisions);
      cursor = res.data.nextCursor;
      if (!cursor) break;
    }
    this.history = all;
  }

  private async loadAudit(): Promise<void> {
    if (this.scenarioId === null) return;
    const res = await this.call<{ entries: AuditEntry[] }>('GET', `/scenarios/${this.scenarioId}/audit`);
    this.audit = res.ok ? res.data.entries : [];
  }

  /** Records the shown revision as issued for construction (who and when go in the audit trail). */
  private async issue(): Promise<void> {
    if (this.scenarioId === null || this.shownRevision === null) return;
    const res = await this.call<AuditEntry>('POST', `/scenarios/${this.scenarioId}/issued`, { revision: this.shownRevision });
    this.message = res.ok ? `Revision ${this.shownRevision} recorded as issued for construction.` : this.describeError(res.body, 'Could not record the issue.');
    if (res.ok) await this.loadAudit();
  }

  private async restore(revision: number): Promise<void> {
    if (this.scenarioId === null || this.revision === null) return;
    const res = await this.call<RevisionMeta>('POST', `/scenarios/${this.scenarioId}/restore`, { revision, baseRevision: this.revision, savedBy: this.savedBy });
    if (res.ok) {
      await this.open(this.scenarioId);
      this.message = `Revision ${revision} restored as revision ${res.data.revision}.`;
    } else if (res.status === 409 && res.body.latest) {
      this.conflict = res.body.latest;
    } else {
      this.message = this.describeError(res.body, 'Not restored.');
    }
  }

  private async loadLinks(): Promise<void> {
    if (this.scenarioId === null) return;
    const res = await this.call<{ links: LinkInfo[] }>('GET', `/scenarios/${this.scenarioId}/links`);
    this.links = res.ok ? res.data.links : [];
  }

  private async createLink(): Promise<void> {
    if (this.scenarioId === null) return;
    const root = this.renderRoot;
    const mode = (root.querySelector('select[name="mode"]') as HTMLSelectElement).value as 'view' | 'edit';
    const pin = (root.querySelector('select[name="pin"]') as HTMLSelectElement).value === 'pin';
    const label = (root.querySelector('input[name="label"]') as HTMLInputElement).value;
    const res = await this.call<{ sitePath: string; mode: string }>('POST', `/scenarios/${this.scenarioId}/links`, { mode, label, revision: pin ? this.shownRevision : null });
    if (!res.ok) {
      this.message = this.describeError(res.body, 'No link made.');
      return;
    }
    this.newLink = { url: new URL(res.data.sitePath, window.location.href).href, mode: res.data.mode };
    await this.loadLinks();
  }

  private async revoke(linkId: string): Promise<void> {
    if (this.scenarioId === null) return;
    const res = await this.call<unknown>('DELETE', `/scenarios/${this.scenarioId}/links/${linkId}`);
    if (!res.ok) this.message = this.describeError(res.body, 'Not revoked.');
    await this.loadLinks();
  }

  private renderSignIn() {
    const setup = this.setupOpen;
    return html`<section>
        <h3>${setup ? 'Make the first admin account' : 'Sign in to the store'}</h3>
        <p class="status">${setup
          ? 'This one-time link makes the first account (admin). Choose a user name and a password of at least 12 characters.'
          : 'Stored scenarios, links, readings and exports need an account. The plan map and calculations work without one.'}</p>
        <form @submit=${(e: Event) => this.signIn(e)}>
          <div class="row"><input name="username" autocomplete="username" placeholder="User name" required maxlength="64" />
            <input name="password" type="password" autocomplete=${setup ? 'new-password' : 'current-password'} placeholder="Password" required minlength=${setup ? 12 : 1} maxlength="1024" />
            <button type="submit">${setup ? 'Make account' : 'Sign in'}</button></div>
        </form>
        ${this.message ? html`<p class="status error" role="alert">${this.message}</p>` : nothing}
      </section>`;
  }

  override render() {
    if (!this.account) return this.renderSignIn();
    const stored = this.scenarioId !== null;
    return html`
      <div class="row account">Signed in as ${this.account.username} (${this.account.role})
        <button class="secondary" @click=${() => this.signOut()}>Sign out</button></div>
      <section>
        <h3>Store on the server</h3>
        <div class="status">${stored ? html`Stored, showing revision ${this.shownRevision}${this.shownRevision !== this.revision ? ` (latest ${this.revision})` : ''}` : 'Not stored yet'}
          ${this.dirty ? html` — <span class="dirty">unsaved changes</span>` : nothing}</div>
        <div class="row">
          <input name="savedBy" placeholder="Your name" .value=${this.savedBy} @input=${(e: Event) => { this.savedBy = (e.target as HTMLInputElement).value; }} maxlength="200" />
          <input name="note" placeholder="What changed (optional)" maxlength="2000" />
          <button @click=${() => this.save()} ?disabled=${this.busy || !this.scenario}>${stored ? 'Store new revision' : 'Store on server'}</button>
        </div>
        ${this.newer && !this.conflict
          ? html`<div class="newer" role="status">Revision ${this.newer.revision} was saved ${new Date(this.newer.savedAt).toLocaleString()}${this.newer.savedBy ? ` by ${this.newer.savedBy}` : ''} (${this.newer.summary}). Your edits start from revision ${this.revision}.
              <div class="row"><button class="secondary" @click=${() => this.scenarioId && this.open(this.scenarioId)}>Load revision ${this.newer.revision}</button></div></div>`
          : nothing}
        ${this.conflict ? this.renderConflict(this.conflict) : nothing}
        ${this.message ? html`<p class="status" role="status">${this.message}</p>` : nothing}
      </section>
      <section>
        <h3>Stored scenarios</h3>
        <button class="secondary" @click=${() => this.loadListing()}>List</button>
        ${this.listing ? html`<table><tbody>${this.listing.map((s) => html`<tr><td>${s.name}</td><td>rev ${s.latestRevision}, ${new Date(s.latestSavedAt).toLocaleString()}</td>
          <td><button class="secondary" @click=${() => this.open(s.scenarioId)}>Open</button></td></tr>`)}</tbody></table>` : nothing}
      </section>
      ${stored ? this.renderStored() : nothing}`;
  }

  private renderConflict(latest: RevisionMeta & { scenario: Scenario }) {
    return html`<div class="conflict" role="alert">
      <strong>Not saved: someone saved first.</strong> Revision ${latest.revision} was saved ${new Date(latest.savedAt).toLocaleString()}${latest.savedBy ? ` by ${latest.savedBy}` : ''}: ${latest.summary}. Your edit started from revision ${this.revision}.
      <div class="row">
        <button class="secondary" @click=${() => this.download(this.scenario!, 'my-edit')}>Download my edit</button>
        <button class="secondary" @click=${() => this.loaded(latest.scenario, latest.scenarioId ?? this.scenarioId!, latest.revision)}>Load revision ${latest.revision} (theirs)</button>
        <button @click=${() => this.save(latest.revision)}>Save mine as revision ${latest.revision + 1}</button>
      </div>
      <p class="status">Saving yours on top keeps theirs in the history; compare them there.</p></div>`;
  }

  private renderStored() {
    const id = this.scenarioId!;
    const ex = (f: string) => `${this.apiBase}/scenarios/${id}/export/${f}?revision=${this.shownRevision}`;
    return html`
      <section>
        <h3>History</h3>
        <button class="secondary" @click=${() => this.loadHistory()}>Show history</button>
        ${this.history ? html`<table><thead><tr><th>Rev</th><th>When / who</th><th>What changed</th><th></th></tr></thead><tbody>
          ${this.history.map((r) => html`<tr><td>${r.revision}</td><td>${new Date(r.savedAt).toLocaleString()}<br />${r.savedBy}</td><td>${r.summary}${r.note ? html`<br /><em>${r.note}</em>` : nothing}</td>
            <td><button class="secondary" @click=${() => this.open(id, r.revision)}>Open</button>
              ${r.revision !== this.history?.[0]?.revision ? html`<button class="secondary" @click=${() => this.restore(r.revision)}>Restore</button>` : nothing}</td></tr>`)}</tbody></table>` : nothing}
      </section>
      <section>
        <h3>Audit</h3>
        <div class="row">
          <button class="secondary" @click=${() => this.loadAudit()}>Show audit</button>
          ${this.account?.role !== 'viewer' ? html`<button class="secondary" @click=${() => this.issue()}>Record revision ${this.shownRevision} as issued for construction</button>` : nothing}
        </div>
        ${this.audit ? html`<table class="audit"><thead><tr><th>When</th><th>Who</th><th>What</th></tr></thead><tbody>
          ${this.audit.map((e) => html`<tr><td>${new Date(e.at).toLocaleString()}</td><td>${e.actor}</td><td>${e.action}${e.revision !== null ? ` (rev ${e.revision})` : ''}${e.detail ? html`<br /><em>${e.detail}</em>` : nothing}</td></tr>`)}</tbody></table>` : nothing}
      </section>
      <section>
        <h3>Share with the site team</h3>
        <div class="row">
          <select name="mode"><option value="view">view only</option><option value="edit">edit (readings, saves)</option></select>
          <select name="pin"><option value="pin">fixed to revision ${this.shownRevision}</option><option value="latest">follows the latest</option></select>
          <input name="label" placeholder="Label, e.g. site team phase 1" maxlength="200" />
          <button @click=${() => this.createLink()}>Make link</button>
          <button class="secondary" @click=${() => this.loadLinks()}>Show links</button>
        </div>
        ${this.newLink ? html`<p>New ${this.newLink.mode} link (shown once; copy it now): <code>${this.newLink.url}</code>
          <button class="secondary" @click=${() => navigator.clipboard?.writeText(this.newLink!.url)}>Copy</button></p>` : nothing}
        ${this.links ? html`<table><tbody>${this.links.map((l) => html`<tr><td>${l.mode}</td><td>${l.revision === null ? 'latest' : `rev ${l.revision}`}</td><td>${l.label}</td>
          <td>${l.revokedAt ? `revoked ${new Date(l.revokedAt).toLocaleDateString()}` : html`<button class="secondary" @click=${() => this.revoke(l.linkId)}>Revoke</button>`}</td></tr>`)}</tbody></table>` : nothing}
      </section>
      <section>
        <h3>Export revision ${this.shownRevision}</h3>
        <div class="row">
          <a href=${ex('scenario-json')}>Scenario JSON</a> <a href=${ex('setout-csv')}>Set-out CSV</a> <a href=${ex('geojson')}>GeoJSON</a>
          <a href=${ex('dxf')}>DXF</a> <a href=${ex('report-html')} target="_blank" rel="noopener">Report (print to PDF)</a> <a href=${ex('monitoring-csv')}>Monitoring CSV</a>
        </div>
        ${this.dirty ? html`<p class="status dirty">Exports show the saved revision, not your unsaved changes.</p>` : nothing}
      </section>`;
  }
}
if (!customElements.get('scenario-store-panel')) customElements.define('scenario-store-panel', ScenarioStorePanel);
