import { useEffect } from 'react';

/** Sets the browser tab's title for the screen on show: "Hangar · Bindery". */
export function useDocumentTitle(title: string): void {
  useEffect(() => {
    document.title = title ? `${title} · Bindery` : 'Bindery';
  }, [title]);
}
