import { useEffect } from 'react';
import type { EditorStore } from '../editor/editor-store';
import type { Saver } from '../editor/saver';

/**
 * The autosave's ties to the browser: save at once when the tab is hidden or the page goes away (with
 * keepalive, so the request outlives the page), try again when the connection comes back, and ask before
 * closing only while the server does not have the latest changes yet.
 */
export function useAutosaveEvents(store: EditorStore | null, saver: Saver | null, enabled: boolean) {
  useEffect(() => {
    if (!enabled || !store || !saver) return undefined;
    const stop = saver.start();
    const hidden = () => {
      if (document.visibilityState === 'hidden') void saver.flush({ keepalive: true });
    };
    const pagehide = () => void saver.flush({ keepalive: true });
    const online = () => void saver.flush();
    const beforeunload = (event: BeforeUnloadEvent) => {
      const state = store.getState();
      if (state.plan === state.serverPlan) return;
      void saver.flush({ keepalive: true });
      event.preventDefault();
      // Older browsers show the prompt only when returnValue is set.
      event.returnValue = '';
    };
    document.addEventListener('visibilitychange', hidden);
    window.addEventListener('pagehide', pagehide);
    window.addEventListener('online', online);
    window.addEventListener('beforeunload', beforeunload);
    return () => {
      document.removeEventListener('visibilitychange', hidden);
      window.removeEventListener('pagehide', pagehide);
      window.removeEventListener('online', online);
      window.removeEventListener('beforeunload', beforeunload);
      // Leaving the hull inside the app: what is not on the server yet goes now.
      void saver.flush();
      stop();
    };
  }, [store, saver, enabled]);
}
