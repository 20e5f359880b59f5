import { cleanup } from '@testing-library/react';
import { afterEach, vi } from 'vitest';
import { takeUnexpectedCalls } from './api-stub';

// happy-dom 21 has no HTMLSelectElement.size. Browsers answer 0 for a plain drop-down, and
// react-hook-form reads it to tell a select the person changed from one it should set to its default
// value; without it every registered select in a test would fall back to its first option.
if (!('size' in HTMLSelectElement.prototype)) {
  Object.defineProperty(HTMLSelectElement.prototype, 'size', {
    configurable: true,
    get(this: HTMLSelectElement) {
      const size = Number.parseInt(this.getAttribute('size') ?? '', 10);
      return Number.isNaN(size) || size < 0 ? 0 : size;
    },
    set(this: HTMLSelectElement, value: number) {
      this.setAttribute('size', String(value));
    },
  });
}

// vitest runs without globals here, so Testing Library cannot register its own cleanup.
afterEach(async () => {
  cleanup();
  // Unmounting a hull page sends what is not on the server yet (the autosave's last flush); let it reach
  // the test's stubbed fetch, where an unexpected request fails the test, rather than the real network.
  await new Promise((resolve) => setTimeout(resolve, 0));
  vi.unstubAllGlobals();
  const unexpected = takeUnexpectedCalls();
  // A request the test did not stub is a bug in the app or in the test: fail, never let it pass by accident.
  if (unexpected.length > 0) throw new Error(`Requests with no stub: ${unexpected.join(', ')}`);
});
