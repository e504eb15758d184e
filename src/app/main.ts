/**
 * Placeholder page: the sheet presets from the core with the electron-counting rule, and the demo scenario's
 * candidate patterns (enumerated here, in the browser, from the demo's measured cell). The real view (sheet and
 * bands side by side) replaces this in the web-view issue.
 */
import demo from '../../presets/demo/harbour-lab.json' with { type: 'json' };
import { enumerateStructures } from '../enumerate/index.ts';
import { holeDensity, patternCell, patternToSheet } from '../lattice/pattern.ts';
import { periodicityMismatch, periodicityOf, reducedPeriodicity } from '../lattice/periodicity.ts';
import { SHEET_PRESETS } from '../lattice/presets.ts';
import { countingRuleDoping } from '../tb/countingRule.ts';

function fillTable(selector: string, rows: string[][], numeric: (column: number) => boolean): void {
  const body = document.querySelector(`${selector} tbody`)!;
  for (const cells of rows) {
    const row = document.createElement('tr');
    cells.forEach((text, column) => {
      const cell = document.createElement('td');
      cell.textContent = text;
      if (numeric(column)) cell.className = 'num';
      row.append(cell);
    });
    body.append(row);
  }
}

fillTable(
  '#presets',
  SHEET_PRESETS.map((preset) => {
    const eta = holeDensity(preset.pattern);
    return [preset.title, eta.toFixed(4), String(patternToSheet(preset.pattern).atoms.length), countingRuleDoping(eta).toFixed(3), preset.source];
  }),
  (column) => column > 0 && column < 4,
);

// The demo: which isolated-hole patterns of up to 12 sites fit the measured cell?
const measured = demo.measured_periodicity;
const target = periodicityOf(measured.a_angstrom, measured.b_angstrom, measured.gamma_deg);
const candidates: string[][] = [];
for (const structure of enumerateStructures({ sites: [1, 12], holes: [1, 3], isolated: true })) {
  const cell = reducedPeriodicity(patternCell(structure.pattern));
  const miss = periodicityMismatch(cell, target);
  if (miss.length > measured.uncertainty_angstrom || miss.angleDeg > 3) continue;
  candidates.push([
    structure.phase ?? '—',
    `${structure.sites} / ${structure.holes}`,
    structure.eta.toFixed(4),
    `${cell.a.toFixed(2)} × ${cell.b.toFixed(2)} Å, ${cell.gammaDeg.toFixed(1)}°`,
    countingRuleDoping(structure.eta).toFixed(3),
  ]);
}
document.querySelector('#demo-title')!.textContent = demo.title;
document.querySelector('#demo-question')!.textContent = `${demo.lab}, sample ${demo.sample}: ${demo.question}`;
fillTable('#candidates', candidates, (column) => column > 0);
document.querySelector('#demo')!.textContent = JSON.stringify(demo, null, 2);
