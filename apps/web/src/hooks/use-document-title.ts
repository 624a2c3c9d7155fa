import { useEffect } from 'react';

export const PRODUCT_NAME = 'Scrap Relay';

/** Tab title per page, so a tab (and a screen reader's page announcement) says where you are. */
export function useDocumentTitle(title: string): void {
  useEffect(() => {
    document.title = title ? `${title} · ${PRODUCT_NAME}` : PRODUCT_NAME;
  }, [title]);
}
