/**
 * Panels kept across renders. The page redraws from its state on every
 * change; a panel wrapped in keptPanel is rebuilt only when one of its
 * inputs changed (compared with Object.is, so pass the objects it is drawn
 * from, or a string for values made afresh on each render). An edit
 * elsewhere then leaves its DOM node alone, with what the user did to it:
 * an open <details>, a text selection, the scroll of a table.
 */
const panels = new Map<string, { inputs: readonly unknown[]; node: Node | null }>();

export function keptPanel<T extends Node | null>(name: string, inputs: readonly unknown[], build: () => T): T {
  const known = panels.get(name);
  if (known !== undefined && known.inputs.length === inputs.length && known.inputs.every((v, i) => Object.is(v, inputs[i]))) return known.node as T;
  const node = build();
  panels.set(name, { inputs, node });
  return node;
}
