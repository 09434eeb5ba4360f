import { cleanup, configure } from '@testing-library/react';
import { afterEach, vi } from 'vitest';

// Pages that draw many tiles can take more than the default second on a busy two-core machine.
configure({ asyncUtilTimeout: 5000 });

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  localStorage.clear();
});
