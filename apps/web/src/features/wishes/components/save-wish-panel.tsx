import { compactFilters, countFilters, describeShelfFilters, type ShelfFilters, type UnitSystem, type WishInput, wishSchema } from '@scrap-relay/shared';
import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { paths } from '../../../config/paths.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Form, SubmitButton, TextField } from '../../../components/ui/form.tsx';
import { useCreateWish } from '../api/create-wish.ts';
import { useSavedWish } from '../hooks/use-saved-wish.ts';

const NAME_MAX = 80;

export interface SaveWishPanelProps {
  filters: ShelfFilters;
  units: UnitSystem;
  currency: string;
}

/**
 * "Save these filters as a wish": asks for a name, then keeps the shelf's current filters as a standing request.
 * Filters already saved as one of the member's wishes say so instead: a second copy would only repeat the e-mails.
 */
export function SaveWishPanel({ filters, units, currency }: SaveWishPanelProps) {
  const [open, setOpen] = useState(false);
  const [saved, setSaved] = useState<string | null>(null);
  const formId = useId();
  const hintId = useId();
  const hasFilters = countFilters(filters) > 0;
  const words = describeShelfFilters(filters, { units, currency });
  const { savedWish } = useSavedWish(filters);

  return (
    <section aria-label="Save as a wish" className="space-y-3 rounded-stitch border-2 border-seam bg-muslin p-4 shadow-quilt">
      {saved ? (
        <Alert tone="success" title={`Wish saved: “${saved}”`}>
          <p>
            We will e-mail you when the librarian approves a bundle that matches. <Link to={paths.app.wishes.getHref()}>See your wishes</Link>
          </p>
        </Alert>
      ) : null}
      {open ? (
        <WishNameForm
          // A fresh form for each set of filters, so the suggested name follows them.
          key={words}
          id={formId}
          filters={filters}
          suggestedName={words.slice(0, NAME_MAX)}
          onSaved={(name) => {
            setSaved(name);
            setOpen(false);
          }}
          onCancel={() => setOpen(false)}
        />
      ) : savedWish ? (
        <>
          <Button variant="secondary" className="w-full" disabled aria-describedby={hintId}>
            <span aria-hidden="true">✓ </span>Saved as a wish
          </Button>
          <p id={hintId} className="text-thread-soft">
            These filters are your wish “{savedWish.name}”: you get an e-mail when a bundle that matches is approved.
            {saved ? null : (
              <>
                {' '}
                <Link to={paths.app.wishes.getHref()}>See your wishes</Link>
              </>
            )}
          </p>
        </>
      ) : (
        <>
          <Button
            variant="secondary"
            className="w-full"
            disabled={!hasFilters}
            aria-describedby={hasFilters ? undefined : hintId}
            onClick={() => {
              setSaved(null);
              setOpen(true);
            }}
          >
            Save these filters as a wish
          </Button>
          <p id={hintId} className="text-thread-soft">
            {hasFilters ? 'You get one e-mail when a new bundle that matches is approved.' : 'Choose at least one filter first, then save it as a wish.'}
          </p>
        </>
      )}
    </section>
  );
}

interface WishNameFormProps {
  id: string;
  filters: ShelfFilters;
  suggestedName: string;
  onSaved: (name: string) => void;
  onCancel: () => void;
}

function WishNameForm({ id, filters, suggestedName, onSaved, onCancel }: WishNameFormProps) {
  const createWish = useCreateWish();
  return (
    <Form<z.input<typeof wishSchema>, WishInput>
      id={id}
      schema={wishSchema}
      defaultValues={{ name: suggestedName, filters: compactFilters(filters) }}
      onSubmit={async (input) => {
        const { wish } = await createWish.mutateAsync(input);
        onSaved(wish.name);
      }}
      className="space-y-4"
    >
      <TextField name="name" label="Name this wish" hint="It is the subject of the e-mail you get." autoComplete="off" maxLength={NAME_MAX} autoFocus />
      <div className="flex flex-wrap gap-3">
        <SubmitButton pendingLabel="Saving…">Save wish</SubmitButton>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </Form>
  );
}
