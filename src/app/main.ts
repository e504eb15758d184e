/**
 * Placeholder page: lists the sheet presets from the core with the electron-counting rule, and the demo scenario.
 * The real view (sheet and bands side by side) replaces this in the web-view issue.
 */
import demo from '../../presets/demo/harbour-lab.json' with { type: 'json' };
import { holeDensity, patternToSheet } from '../lattice/pattern.ts';
import { SHEET_PRESETS } from '../lattice/presets.ts';

const body = document.querySelector('#presets tbody')!;
for (const preset of SHEET_PRESETS) {
  const eta = holeDensity(preset.pattern);
  const doping = 8 / (3 * (1 - eta)) - 3; // electron-counting rule, see src/tb (σ-bonding analysis)
  const row = document.createElement('tr');
  const cells = [preset.title, eta.toFixed(4), String(patternToSheet(preset.pattern).atoms.length), doping.toFixed(3), preset.source];
  cells.forEach((text, index) => {
    const cell = document.createElement('td');
    cell.textContent = text;
    if (index > 0 && index < 4) cell.className = 'num';
    row.append(cell);
  });
  body.append(row);
}
document.querySelector('#demo-title')!.textContent = demo.title;
document.querySelector('#demo')!.textContent = JSON.stringify(demo, null, 2);
