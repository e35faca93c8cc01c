import { parseIon, romanOxidationState } from '../../chemistry/ions.js';
import { boxArrows } from '../../predict/occupation.js';
import { isLowSpinGSource } from '../../predict/low-spin-g.js';
import type { Prediction, UsedFactor } from '../../series/predict.js';
import { formatPlusMinus } from '../../report/plus-minus.js';
import { probabilityText } from '../../report/probability.js';
import { NO_SPIN_STATE_CHOICE } from '../../report/spin-state-wording.js';

/**
 * The readable report of `fieldgap predict`: every line fits an 80-column
 * terminal (long sentences are wrapped with a hanging indent). Energies in
 * cm-1, wavelengths in nm beside them; ± is one standard deviation.
 */
export const REPORT_WIDTH = 80;

/** Words of `text` wrapped to `width` columns, the first line after `first`, the rest after `indent`. */
export function wrapText(text: string, first: string, indent: string, width = REPORT_WIDTH): string[] {
  const lines: string[] = [];
  let line = first;
  let empty = true;
  for (const word of text.split(/\s+/).filter(Boolean)) {
    const joined = empty ? `${line}${word}` : `${line} ${word}`;
    if ([...joined].length > width && !empty) {
      lines.push(line);
      line = `${indent}${word}`;
    } else {
      line = joined;
    }
    empty = false;
  }
  lines.push(line);
  // A single word longer than the width (a URL) is cut rather than overflowing.
  return lines.flatMap((l) => chunk(l, width, indent));
}

function chunk(line: string, width: number, indent: string): string[] {
  const chars = [...line];
  if (chars.length <= width) return [line];
  const out = [chars.slice(0, width).join('')];
  let rest = chars.slice(width);
  while (rest.length > 0) {
    const room = width - indent.length;
    out.push(indent + rest.slice(0, room).join(''));
    rest = rest.slice(room);
  }
  return out;
}

const round = (x: number, step: number): number => Math.round(x / step) * step;
const cm = (x: number): string => String(Math.round(x));

function pm(value: number, sigma: number | undefined, digits: number): string {
  return formatPlusMinus(value, sigma, { digits, showZero: true });
}

function factorText(name: string, f: UsedFactor, digits: number, unit = ''): string {
  return `${name} = ${pm(f.value, f.uncertainty, digits)}${unit} (${f.kind})`;
}

const SUPERSCRIPT: Record<string, string> = { 0: '⁰', 1: '¹', 2: '²', 3: '³', 4: '⁴', 5: '⁵', 6: '⁶' };

/** "t2g^6 eg^0" → "t2g⁶ eg⁰": the count as a superscript, so "t2⁴" is not read as "t24". */
export function configurationText(configuration: string): string {
  return configuration.replace(/\^(\d)/g, (_m, digit: string) => SUPERSCRIPT[digit] ?? digit);
}

/** A horizontal bar of `value` on a scale whose full length is `max`. */
function bar(value: number, max: number, length: number): string {
  const n = Math.max(0, Math.min(length, Math.round((value / max) * length)));
  return '█'.repeat(n) + ' '.repeat(length - n);
}

/** The energy-scale block: 10Dq beside the crossover and the mean pairing energy. */
export function energyScaleLines(p: Prediction): string[] {
  const rows: [string, number][] = [['10Dq', p.tenDq.value]];
  const numbers = p.spinDecision.numbers;
  if (numbers) {
    rows.push(['crossover', numbers.crossoverTenDq]);
    if (numbers.pairingEnergy) rows.push([`Π ${numbers.pairingEnergy.expression}`, numbers.pairingEnergy.value]);
  }
  if (rows.length === 1) return [];
  const max = Math.max(...rows.map((r) => r[1]));
  const label = Math.max(...rows.map((r) => r[0].length));
  return [
    'Energy scale (cm-1; low-spin when 10Dq is beyond the crossover):',
    ...rows.map(([name, value]) => `  ${name.padEnd(label)}  ${bar(value, max, 40)}  ${cm(value).padStart(6)}`),
  ];
}

/** The orbital diagram: highest set first, one box per orbital, arrows for electrons. */
export function orbitalLines(p: Prediction): string[] {
  const sets = [...p.occupation.sets].reverse();
  const name = Math.max(...sets.map((s) => s.name.length));
  return sets.map((s) => {
    const energy = `${s.energyDq > 0 ? '+' : s.energyDq < 0 ? '−' : ' '}${Math.abs(s.energyDq)} Dq`;
    return `  ${s.name.padEnd(name)}  ${s.boxes.map((b) => `[${boxArrows(b)}]`).join('')}`.padEnd(name + 22) + energy;
  });
}

function spinText(p: Prediction): string {
  const d = p.spinDecision;
  if (p.spinState.value === 'no-choice') return NO_SPIN_STATE_CHOICE;
  const probability = d.numbers ? `, ${probabilityText(p.spinState.value === 'low-spin' ? d.numbers.probabilities.lowSpin : d.numbers.probabilities.highSpin)}` : '';
  if (d.decidedBy === 'rule') return `${p.spinState.value} (by rule${probability ? `; numbers alone${probability}` : ''})`;
  return `${p.spinState.value}${d.borderline ? ', BORDERLINE' : ''} (by the numbers${probability})`;
}

/** The readable report of `predict`, with units, fitting 80 columns. */
export function predictionReport(p: Prediction): string {
  const metal = parseIon(p.ion);
  const metalName = `${metal.name ?? metal.symbol}(${romanOxidationState(p.oxidationState)})`;
  const out: string[] = [];
  const add = (text: string, first = '', indent = '    ') => out.push(...wrapText(text, first, indent));
  add(`${p.complexIon}: ${metalName}, ${p.ion}, d${p.d}`);
  // A forgotten charge changes the oxidation state and every number below: said on top, not only among the warnings.
  if (p.warnings.some((w) => /taken as neutral/.test(w))) {
    add(`Charge: none given, so the complex is read as neutral and the metal as ${metalName}; if you meant an ion, write its charge after the bracket, e.g. "${p.complexIon}2+"`, 'NOTE ', '    ');
  }
  add(`Ligands: ${p.ligands.map((l) => `${l.count} × ${l.key} (${l.name})`).join(', ')}; coordination number ${p.coordinationNumber}`);
  add(`Geometry: ${p.geometry.value} (${p.geometry.method})`);
  out.push('', 'Estimates (from tabulated factors, not measurements; ± one standard deviation):');
  // d0, d1, d9, d10 have no electron-repulsion terms in their ligand-field levels.
  const none = p.d <= 1 || p.d >= 9 ? `not needed for d${p.d}` : 'not estimated';
  const rows: [string, string][] = [
    ['10Dq', `${cm(p.tenDq.value)} cm-1 (${cm(1e7 / p.tenDq.value)} nm), ± ${cm(round(p.tenDq.uncertainty ?? 0, 10))}${isLowSpinGSource(p.ion, p.complexIon, p.tenDq.method) ? ` (circular: the low-spin g of ${p.ion} is taken from this complex, so this is its published value back, not an independent estimate)` : ''}`],
    ['beta', p.beta ? pm(p.beta.value, p.beta.uncertainty, 2) : none],
    ['Racah B', p.b ? `${cm(p.b.value)} ± ${cm(p.b.uncertainty ?? 0)} cm-1` : none],
    ['Racah C', p.c ? `${cm(p.c.value)} cm-1 (C/B kept at the free-ion ratio)` : none],
    ['spin state', spinText(p)],
    ['unpaired electrons', String(p.unpairedElectrons.value)],
    ['ground term', p.groundTerm.value],
    ['spin-only moment', `${p.spinOnlyMoment.value.toFixed(2)} μB${p.orbitalContribution.expected ? ' (orbital contribution expected)' : ''}`],
    ['LFSE', `${p.lfse.deltaUnits.toFixed(2)} Δ = ${cm(p.lfse.value)} ± ${cm(round(p.lfse.uncertainty, 10))} cm-1 (without pairing energy)`],
  ];
  const width = Math.max(...rows.map((r) => r[0].length));
  for (const [label, value] of rows) add(value, `  ${label.padEnd(width)}  `, ' '.repeat(width + 4));
  out.push('', `Why (${configurationText(p.occupation.configuration)}):`);
  out.push(...orbitalLines(p));
  const scale = energyScaleLines(p);
  if (scale.length) out.push('', ...scale);
  out.push('');
  add(p.spinDecision.summary, 'Spin state: ', '    ');
  add(p.orbitalContribution.why, 'Magnetism: ', '    ');
  out.push('', 'Factors:');
  for (const l of p.ligands) add(`${factorText('f', l.fFactor, 2)}, ${factorText('h', l.hFactor, 1)}`, `  ${l.key}: `, '    ');
  add(`${factorText('g', p.metalFactors.g, 0, ' cm-1')}, ${factorText('k', p.metalFactors.k, 2)}`, `  ${p.ion}: `, '    ');
  if (p.warnings.length > 0) {
    out.push('', 'Warnings:');
    for (const w of p.warnings) add(w, '  - ', '    ');
  }
  out.push('', 'Sources:');
  for (const s of p.sources) add(s, '  - ', '    ');
  return `${out.join('\n')}\n`;
}

/** One cell of the comparison, cut to `width` with an ellipsis when longer. */
function cell(text: string, width: number): string {
  const chars = [...text];
  return chars.length <= width ? text.padEnd(width) : `${chars.slice(0, width - 1).join('')}…`;
}

/** Two predictions side by side (`predict A --vs B`), 80 columns: label 18, two columns of 29. */
export function comparisonReport(a: Prediction, b: Prediction): string {
  const label = 18;
  const column = 29;
  const rulesOf = (p: Prediction) => [...new Set([p.geometryRule, p.spinDecision.rule].filter((r) => r !== null))];
  const decided = (p: Prediction): string => (p.spinDecision.decidedBy === 'rule' ? `rule ${p === a ? 'A' : 'B'} (below)` : p.spinDecision.decidedBy === 'numbers' ? `numbers${p.spinDecision.borderline ? ' (borderline)' : ''}` : 'no spin choice');
  const spin = (p: Prediction): string => {
    const n = p.spinDecision.numbers;
    if (p.spinState.value === 'no-choice') return NO_SPIN_STATE_CHOICE;
    const prob = n ? `, ${probabilityText(p.spinState.value === 'low-spin' ? n.probabilities.lowSpin : n.probabilities.highSpin)}` : '';
    return p.spinDecision.decidedBy === 'rule' ? p.spinState.value : `${p.spinState.value}${prob}`;
  };
  const rows: [string, (p: Prediction) => string][] = [
    ['complex', (p) => p.complexIon],
    ['metal, d-count', (p) => `${p.ion}, d${p.d}`],
    ['geometry', (p) => p.geometry.value],
    ['10Dq / cm-1', (p) => `${cm(p.tenDq.value)} ± ${cm(round(p.tenDq.uncertainty ?? 0, 10))}`],
    ['crossover / cm-1', (p) => (p.spinDecision.numbers ? cm(p.spinDecision.numbers.crossoverTenDq) : '—')],
    ['Π / cm-1', (p) => (p.spinDecision.numbers?.pairingEnergy ? cm(p.spinDecision.numbers.pairingEnergy.value) : '—')],
    ['beta', (p) => (p.beta ? pm(p.beta.value, p.beta.uncertainty, 2) : '—')],
    ['spin state', spin],
    ['decided by', decided],
    ['configuration', (p) => configurationText(p.occupation.configuration)],
    ['unpaired electrons', (p) => String(p.unpairedElectrons.value)],
    ['spin-only moment', (p) => `${p.spinOnlyMoment.value.toFixed(2)} μB${p.orbitalContribution.expected ? ' + orbital' : ''}`],
    ['ground term', (p) => p.groundTerm.value],
    ['LFSE', (p) => `${p.lfse.deltaUnits.toFixed(2)} Δ = ${cm(p.lfse.value)} cm-1`],
  ];
  const lines = ['Side by side (estimates from tabulated factors, not measurements):', ''];
  for (const [name, get] of rows) lines.push(`${name.padEnd(label)}  ${cell(get(a), column)}  ${cell(get(b), column)}`.trimEnd());
  // The orbital boxes, highest set first, one line per set.
  const boxes = (p: Prediction): string[] => [...p.occupation.sets].reverse().map((set) => `${set.name.padEnd(6)} ${set.boxes.map((x) => `[${boxArrows(x)}]`).join('')}`);
  const left = boxes(a);
  const right = boxes(b);
  for (let i = 0; i < Math.max(left.length, right.length); i++) {
    lines.push(`${(i === 0 ? 'orbitals' : '').padEnd(label)}  ${cell(left[i] ?? '', column)}  ${cell(right[i] ?? '', column)}`.trimEnd());
  }
  for (const [letter, p] of [['A', a], ['B', b]] as const) {
    for (const rule of rulesOf(p)) lines.push(...wrapText(`${rule.statement} (${rule.source})`, `Rule ${letter}: `, '    '));
  }
  const notes = [...a.warnings.map((w) => `${a.complexIon}: ${w}`), ...b.warnings.map((w) => `${b.complexIon}: ${w}`)];
  if (notes.length > 0) {
    lines.push('', 'Warnings:');
    for (const w of notes) lines.push(...wrapText(w, '  - ', '    '));
  }
  lines.push('', 'Run predict on each complex alone for the orbital diagrams and the sources.');
  return `${lines.join('\n')}\n`;
}
