// DOM helpers for the panel tests: find inputs by their job-format path and type into them.

import { fireEvent } from '@testing-library/react';

export function byHook<T extends Element = HTMLInputElement>(root: ParentNode, attr: string, value: string): T {
  const el = root.querySelector<T & Element>(`[${attr}="${value}"]`);
  if (!el) throw new Error(`nothing with ${attr}="${value}"`);
  return el as T;
}

export function field<T extends Element = HTMLInputElement>(root: ParentNode, path: string): T {
  return byHook<T>(root, 'data-field', path);
}

export function fieldError(root: ParentNode, path: string): HTMLElement | null {
  return root.querySelector<HTMLElement>(`[data-field-error="${path}"]`);
}

/** Types a value and commits it the way a user does: Enter. */
export function typeAndEnter(input: HTMLInputElement, text: string): void {
  fireEvent.focus(input);
  fireEvent.change(input, { target: { value: text } });
  fireEvent.keyDown(input, { key: 'Enter' });
}

/** Types a value and commits it by leaving the field. */
export function typeAndBlur(input: HTMLInputElement | HTMLTextAreaElement, text: string): void {
  fireEvent.focus(input);
  fireEvent.change(input, { target: { value: text } });
  fireEvent.blur(input);
}

export function choose(select: HTMLSelectElement, value: string): void {
  fireEvent.change(select, { target: { value } });
}
