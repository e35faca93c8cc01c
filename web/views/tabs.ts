/**
/**
 * The view tabs (Analyse, Compare, Library, Predict, Levels) as an ARIA tab list: click or
 * arrow keys move between them; hidden tabs are skipped.
 */
export type TabName = 'analyse' | 'compare' | 'library' | 'predict' | 'levels';

const NAMES: TabName[] = ['analyse', 'compare', 'library', 'predict', 'levels'];

export interface Tabs {
  select(tab: TabName): void;
  /** Shows a tab that starts hidden (a view whose endpoints exist). */
  enable(tab: TabName): void;
}

export function setupTabs(onChange: (tab: TabName) => void): Tabs {
  const button = (tab: TabName): HTMLButtonElement => document.getElementById(`tab-${tab}`) as HTMLButtonElement;
  const panel = (tab: TabName): HTMLElement => document.getElementById(`view-${tab}`) as HTMLElement;
  const select = (tab: TabName): void => {
    // The skip link leads to the view shown: #main (hidden with its tab) would lead nowhere from the others.
    const skip = document.querySelector<HTMLAnchorElement>('a.skip');
    if (skip !== null) {
      skip.href = tab === 'analyse' ? '#main' : `#view-${tab}`;
      skip.textContent = tab === 'analyse' ? 'Skip to the results' : `Skip to the ${button(tab).textContent ?? tab} view`;
    }
    for (const name of NAMES) {
      const chosen = name === tab;
      button(name).setAttribute('aria-selected', String(chosen));
      button(name).tabIndex = chosen ? 0 : -1;
      panel(name).hidden = !chosen;
    }
    onChange(tab);
  };
  for (const name of NAMES) {
    button(name).addEventListener('click', () => select(name));
    button(name).addEventListener('keydown', (event) => {
      if (event.key !== 'ArrowRight' && event.key !== 'ArrowLeft') return;
      const visible = NAMES.filter((n) => !button(n).hidden);
      const at = visible.indexOf(name);
      const next = visible[(at + (event.key === 'ArrowRight' ? 1 : visible.length - 1)) % visible.length]!;
      select(next);
      button(next).focus();
    });
  }
  return {
    select,
    enable(tab) {
      button(tab).hidden = false;
    },
  };
}
