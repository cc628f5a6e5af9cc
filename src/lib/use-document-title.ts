import { useEffect } from 'react';

/** Each page names itself in the tab and in the history list; screen readers announce it on navigation. */
export function useDocumentTitle(title: string): void {
  useEffect(() => {
    document.title = title ? `${title} · Kitlane` : 'Kitlane — remote drum tracks';
  }, [title]);
}
