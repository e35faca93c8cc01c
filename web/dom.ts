/** Small DOM helpers: element building, downloads, focus keeping. */

type Attrs = Record<string, string | number | boolean | undefined | null | EventListener>;
export type Child = Node | string | number | null | undefined | false;

/**
 * h('button', { class: 'x', onclick: fn }, 'Text'): attributes starting
 * with "on" become listeners; false/null/undefined attributes are left out.
 */
export function h<K extends keyof HTMLElementTagNameMap>(tag: K, attrs: Attrs = {}, ...children: (Child | Child[])[]): HTMLElementTagNameMap[K] {
  const el = document.createElement(tag);
  for (const [name, value] of Object.entries(attrs)) {
    if (value === undefined || value === null || value === false) continue;
    if (name.startsWith('on') && typeof value === 'function') el.addEventListener(name.slice(2), value);
    else if (name === 'value' && 'value' in el) (el as HTMLInputElement).value = String(value);
    else if (name === 'checked' && 'checked' in el) (el as HTMLInputElement).checked = value === true;
    else el.setAttribute(name, value === true ? '' : String(value));
  }
  for (const child of children.flat()) {
    if (child === null || child === undefined || child === false) continue;
    el.append(child instanceof Node ? child : String(child));
  }
  return el;
}

/** Saves a text or data URL as a file through a temporary link. */
export function download(fileName: string, content: string, type: string): void {
  const url = content.startsWith('data:') ? content : URL.createObjectURL(new Blob([content], { type }));
  const link = h('a', { href: url, download: fileName });
  document.body.append(link);
  link.click();
  link.remove();
  if (!content.startsWith('data:')) setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Re-renders through `render` while keeping keyboard focus on the element with the same id. */
export function keepingFocus(render: () => void): void {
  const active = document.activeElement;
  const id = active instanceof HTMLElement ? active.id : '';
  render();
  if (id !== '') {
    const again = document.getElementById(id);
    if (again !== null && again !== document.activeElement) again.focus({ preventScroll: true });
  }
}

/** Number from an input, or null when empty or not a number. */
export function numberOrNull(text: string): number | null {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return null;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : null;
}
