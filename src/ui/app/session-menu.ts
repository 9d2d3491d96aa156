/**
 * <session-menu>: named sessions saved in the browser (state/session-store.ts), beside the
 * state the address holds: save the page as a name, list what is saved, load or delete an
 * entry. Entries that cannot be read (another version of the page, a damaged entry) are
 * listed by name with the reason and can only be deleted. Loading sends `session-load`
 * with the state; the page applies it.
 */
import { LitElement, html, css, nothing } from 'lit';
import type { AppState } from '../state/app-state.ts';
import { type SessionList, deleteNamedSession, listSessions, loadNamedSession, saveNamedSession } from '../state/session-store.ts';
import { sharedStyles } from './shared-styles.ts';

export class SessionMenu extends LitElement {
  static override properties = { state: { attribute: false }, open: { state: true }, message: { state: true } };
  /** The page's current state (what "save" stores). */
  declare state: AppState;
  declare open: boolean;
  /** The last outcome, in words (saved, loaded, refused). */
  declare message: { text: string; error: boolean } | null;
  private list: SessionList = listSessions();

  constructor() {
    super();
    this.open = false;
    this.message = null;
  }

  static override styles = [sharedStyles, css`
    :host { position: relative; display: inline-block; }
    .sessions-toggle { background: transparent; color: #fff; border-color: #8f9bb0; }
    .sessions-toggle:hover { background: #2e3848; }
    .panel { position: absolute; right: 0; top: calc(100% + 6px); z-index: 20; width: 340px; max-width: 90vw; background: #fff; color: #1d2430;
      border: 1px solid var(--line); border-radius: 6px; padding: 10px; box-shadow: 0 6px 18px rgba(0,0,0,0.18); }
    .row { display: flex; gap: 6px; align-items: center; }
    .row input { flex: 1; min-width: 0; }
    ul { list-style: none; margin: 8px 0 0; padding: 0; max-height: 260px; overflow: auto; }
    li { display: flex; gap: 6px; align-items: center; padding: 3px 0; border-top: 1px solid #eef1f5; }
    li .name { flex: 1; overflow-wrap: anywhere; }
    li .when { font-size: 11.5px; color: #5b6577; }
    .msg { font-size: 12.5px; margin: 6px 0 0; }
    @media (max-width: 600px) { .panel { position: fixed; left: 8px; right: 8px; top: 8px; width: auto; max-width: none; } }
  `];

  private refresh() {
    this.list = listSessions();
    this.requestUpdate();
  }

  private toggle() {
    this.open = !this.open;
    if (this.open) this.refresh();
  }

  private save() {
    const input = this.renderRoot.querySelector('input[name="session-name"]') as HTMLInputElement | null;
    const name = input?.value ?? '';
    try {
      saveNamedSession(name, this.state);
      this.message = { text: `Saved as "${name.trim()}".`, error: false };
      if (input) input.value = '';
    } catch (e) {
      this.message = { text: (e as Error).message, error: true };
    }
    this.refresh();
  }

  private load(name: string) {
    const r = loadNamedSession(name);
    if ('error' in r) { this.message = { text: r.error, error: true }; return; }
    this.message = { text: `Loaded "${name}".`, error: false };
    this.dispatchEvent(new CustomEvent('session-load', { detail: { state: r.state, name }, bubbles: true, composed: true }));
  }

  private removeSession(name: string) {
    try {
      deleteNamedSession(name);
      this.message = { text: `Deleted "${name}".`, error: false };
    } catch (e) {
      this.message = { text: (e as Error).message, error: true };
    }
    this.refresh();
  }

  override render() {
    const l = this.list;
    const when = (iso: string) => new Date(iso).toLocaleString();
    return html`<button class="sessions-toggle" aria-expanded=${this.open ? 'true' : 'false'} aria-controls="sessions" @click=${this.toggle}>Sessions</button>
      ${this.open ? html`<div class="panel" id="sessions" role="dialog" aria-label="Saved sessions" @keydown=${(e: KeyboardEvent) => { if (e.key === 'Escape') this.open = false; }}>
        <div class="row"><input name="session-name" aria-label="Name of the session to save" placeholder="name"
            @keydown=${(e: KeyboardEvent) => { if (e.key === 'Enter') this.save(); }}>
          <button class="save-session" @click=${this.save}>Save as</button></div>
        <p class="muted msg">Kept in this browser only; the address (Copy link) holds the same state to share.</p>
        ${this.message ? html`<p class="msg ${this.message.error ? 'err' : ''}" role=${this.message.error ? 'alert' : 'status'}>${this.message.text}</p>` : nothing}
        ${l.storeError ? html`<p class="msg err" role="alert">${l.storeError}</p>` : nothing}
        <ul aria-label="Saved sessions list">
          ${l.sessions.map((x) => html`<li class="session" data-name=${x.name}><span class="name">${x.name}</span><span class="when">${when(x.savedAt)}</span>
            <button class="load" @click=${() => this.load(x.name)} aria-label="Load ${x.name}">Load</button>
            <button class="delete" @click=${() => this.removeSession(x.name)} aria-label="Delete ${x.name}">Delete</button></li>`)}
          ${l.refused.map((x) => html`<li class="refused" data-name=${x.name}><span class="name">${x.name}<br><span class="err when">cannot be loaded: ${x.reason}</span></span>
            <button class="delete" @click=${() => this.removeSession(x.name)} aria-label="Delete ${x.name}">Delete</button></li>`)}
          ${!l.sessions.length && !l.refused.length ? html`<li class="muted">No saved sessions yet.</li>` : nothing}
        </ul></div>` : nothing}`;
  }
}
customElements.define('session-menu', SessionMenu);

declare global { interface HTMLElementTagNameMap { 'session-menu': SessionMenu } }
