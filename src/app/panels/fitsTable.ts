/**
 * The Metal panel's table of coincidence fits: angle, strain, both supercells and the moiré cell, one row each.
 */
import type { CoincidenceFit } from '../../substrate/coincidence.ts';

const rows = (m: [[number, number], [number, number]]) => `[${m[0].join(', ')}] [${m[1].join(', ')}]`;

/** The text of each cell of a fit's row (what the table shows; the tests read it too). */
export function fitCells(fit: CoincidenceFit): string[] {
  const moire = fit.moire;
  return [
    `${fit.angleDeg.toFixed(1)}°`,
    `${(100 * fit.strain).toFixed(2)} %`,
    rows(fit.sheetSupercell),
    rows(fit.substrateSupercell),
    fit.wood ?? `${moire.a.toFixed(2)} × ${moire.b.toFixed(2)} Å, ${moire.gammaDeg.toFixed(1)}°`,
  ];
}

export function drawFits(doc: Document, body: HTMLTableSectionElement, fits: readonly CoincidenceFit[]): void {
  body.replaceChildren(...fits.map((fit) => {
    const row = doc.createElement('tr');
    for (const text of fitCells(fit)) row.insertCell().textContent = text;
    row.title = `${fit.sites} metal atoms and ${fit.sheetCells} sheet cells in the coincidence cell (${fit.area.toFixed(1)} Å²); moiré cell ${fit.moire.a.toFixed(2)} × ${fit.moire.b.toFixed(2)} Å, ${fit.moire.gammaDeg.toFixed(1)}°; principal stretches ${fit.stretches.map((s) => s.toFixed(4)).join(', ')}`;
    return row;
  }));
}
