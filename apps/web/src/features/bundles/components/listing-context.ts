import { createContext, useContext } from 'react';
import type { BundleView } from '@scrap-relay/shared';
import type { ListingContext, ListingStep } from '../utils/listing-form.ts';

export interface ListingWizardState extends ListingContext {
  /** Null on the "new" page until the first save. */
  bundle: BundleView | null;
  /** Saves the draft and moves to a step, optionally putting focus on one field there. */
  goToStep: (step: ListingStep, focusField?: string) => void;
}

export const ListingWizardContext = createContext<ListingWizardState | null>(null);

export function useListingWizard(): ListingWizardState {
  const state = useContext(ListingWizardContext);
  if (!state) throw new Error('useListingWizard is used inside the listing wizard only.');
  return state;
}
