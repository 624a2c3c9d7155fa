import { act, type ReactNode } from 'react';
import { createRoot } from 'react-dom/client';

// Tells React this environment wraps updates in act(), so it flushes effects before assertions.
(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

export interface Rendered {
  container: HTMLElement;
  unmount: () => void;
}

const mounted = new Set<Rendered>();

/** Renders into a fresh element on document.body; `cleanup()` (or `unmount`) removes it. */
export async function render(ui: ReactNode): Promise<Rendered> {
  const container = document.createElement('div');
  document.body.append(container);
  const root = createRoot(container);
  await act(async () => root.render(ui));
  const rendered: Rendered = {
    container,
    unmount: () => {
      act(() => root.unmount());
      container.remove();
      mounted.delete(rendered);
    },
  };
  mounted.add(rendered);
  return rendered;
}

export function cleanup(): void {
  for (const rendered of [...mounted]) rendered.unmount();
}

/** Types into an input the way React notices (native value setter + input event). */
export async function typeInto(input: HTMLInputElement, value: string): Promise<void> {
  const setter = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')?.set;
  await act(async () => {
    setter?.call(input, value);
    input.dispatchEvent(new Event('input', { bubbles: true }));
  });
}

export async function click(element: Element): Promise<void> {
  await act(async () => {
    (element as HTMLElement).click();
  });
}

/** Retries `check` (flushing React between tries) until it stops throwing, or fails with its last error. */
export async function waitFor<T>(check: () => T, timeoutMs = 2000): Promise<T> {
  const started = Date.now();
  for (;;) {
    try {
      return check();
    } catch (error) {
      if (Date.now() - started > timeoutMs) throw error;
      await act(async () => {
        await new Promise((resolve) => setTimeout(resolve, 20));
      });
    }
  }
}

export function byLabel<T extends HTMLElement = HTMLInputElement>(root: ParentNode, text: string): T {
  const label = [...root.querySelectorAll('label')].find((candidate) => candidate.textContent?.trim() === text);
  const control = label?.htmlFor ? document.getElementById(label.htmlFor) : null;
  if (!control) throw new Error(`No control labelled "${text}".`);
  return control as T;
}

export function byRole(root: ParentNode, role: string): HTMLElement[] {
  return [...root.querySelectorAll<HTMLElement>(`[role="${role}"]`)];
}

export function buttonNamed(root: ParentNode, name: string | RegExp): HTMLButtonElement {
  const match = [...root.querySelectorAll('button')].find((button) => {
    const text = button.textContent?.trim() ?? '';
    return typeof name === 'string' ? text === name : name.test(text);
  });
  if (!match) throw new Error(`No button named ${String(name)}.`);
  return match;
}
