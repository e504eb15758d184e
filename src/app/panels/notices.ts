/**
 * Messages to the user above the workspace: refused input (with its field), failed jobs, and what was kept.
 * Each stays until dismissed; the same message is not stacked twice.
 */
export class Notices {
  constructor(private readonly host: HTMLElement) {}

  show(message: string, kind: 'error' | 'info' = 'error'): void {
    for (const existing of this.host.querySelectorAll<HTMLElement>('.notice')) {
      if (existing.dataset.message === message) return;
    }
    const doc = this.host.ownerDocument;
    const box = doc.createElement('div');
    box.className = `notice notice-${kind}`;
    box.dataset.message = message;
    const text = doc.createElement('span');
    text.textContent = message;
    const close = doc.createElement('button');
    close.type = 'button';
    close.textContent = 'dismiss';
    close.addEventListener('click', () => box.remove());
    box.append(text, close);
    this.host.append(box);
  }

  clear(): void {
    this.host.replaceChildren();
  }
}
