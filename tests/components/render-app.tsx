import { QueryClient } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter } from 'react-router-dom';
import { AppProvider } from '../../src/app/provider';
import { routes } from '../../src/app/router';

/** The whole app at `path`, in memory, with a fresh query cache that never retries. */
export function renderApp(path: string) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  const user = userEvent.setup();
  const view = render(<AppProvider queryClient={queryClient} router={router} />);
  return {
    ...view,
    user,
    router,
    queryClient,
    /** Where the app is now, as pathname + search. */
    here: () => `${router.state.location.pathname}${router.state.location.search}`,
  };
}

/** The text of everything that describes a control (its hint and its error), as a screen reader hears it. */
export function descriptionOf(control: HTMLElement): string {
  const ids = control.getAttribute('aria-describedby')?.split(/\s+/).filter(Boolean) ?? [];
  return ids.map((id) => document.getElementById(id)?.textContent ?? '').join(' ');
}

/** The element holding `message` that describes `control`, checked to come after it in the page (under it). */
export function errorUnder(control: HTMLElement, message: string): HTMLElement {
  const ids = control.getAttribute('aria-describedby')?.split(/\s+/).filter(Boolean) ?? [];
  const element = ids.map((id) => document.getElementById(id)).find((el) => el?.textContent?.includes(message));
  if (!element) throw new Error(`No description of the control says "${message}"; it says "${descriptionOf(control)}"`);
  if (control.getAttribute('aria-invalid') !== 'true') throw new Error('The control is not marked aria-invalid');
  if (!(control.compareDocumentPosition(element) & Node.DOCUMENT_POSITION_FOLLOWING)) throw new Error('The error is not under the control');
  return element;
}

export { screen };
