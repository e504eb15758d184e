/**
 * Undo and redo of the view's edits: snapshots of the state, newest last. Nothing the user made is lost to a
 * mistaken click: every edit of the sheet, the cell, the parameters or the model's settings can be taken back.
 */
export class EditHistory<T> {
  private readonly past: T[] = [];
  private readonly future: T[] = [];

  constructor(private readonly limit = 200) {}

  /** Remembers `before` as the state to return to; a new edit forgets what was undone. */
  record(before: T): void {
    this.past.push(structuredClone(before));
    if (this.past.length > this.limit) this.past.shift();
    this.future.length = 0;
  }

  undo(current: T): T | undefined {
    const previous = this.past.pop();
    if (previous !== undefined) this.future.push(structuredClone(current));
    return previous;
  }

  redo(current: T): T | undefined {
    const next = this.future.pop();
    if (next !== undefined) this.past.push(structuredClone(current));
    return next;
  }

  get canUndo(): boolean {
    return this.past.length > 0;
  }

  get canRedo(): boolean {
    return this.future.length > 0;
  }
}
