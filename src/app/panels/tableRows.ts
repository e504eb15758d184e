/**
 * Label–value rows of the page's small tables (the electron count, the metal's dopings): the value right-aligned
 * in tabular figures, an optional explanation as the row's tooltip.
 */
export function labelledRow(doc: Document, name: string, value: string, title?: string): HTMLTableRowElement {
  const row = doc.createElement('tr');
  const label = row.insertCell();
  label.textContent = name;
  const cell = row.insertCell();
  cell.className = 'num';
  cell.textContent = value;
  if (title) row.title = title;
  return row;
}
