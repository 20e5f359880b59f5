import { cleanup } from '@testing-library/react';
import { afterEach, vi } from 'vitest';
import { takeUnexpectedCalls } from './api-stub';

// vitest runs without globals here, so Testing Library cannot register its own cleanup.
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  const unexpected = takeUnexpectedCalls();
  // A request the test did not stub is a bug in the app or in the test: fail, never let it pass by accident.
  if (unexpected.length > 0) throw new Error(`Requests with no stub: ${unexpected.join(', ')}`);
});
