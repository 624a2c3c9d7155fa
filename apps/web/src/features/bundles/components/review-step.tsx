import {
  COLOUR_FAMILY_LABELS,
  COLOUR_VALUE_LABELS,
  CUT_KIND_LABELS,
  cutSizesText,
  FIBRE_LABELS,
  formatMoney,
  formatWeight,
  OFFER_LABELS,
} from '@scrap-relay/shared';
import { useEffect, useRef, type ReactNode } from 'react';
import { useWatch } from 'react-hook-form';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { pieceSize } from '../utils/cut-plan-text.ts';
import { checkListing, fieldLabel, STEP_LABELS, stepOfField, type ListingFormValues, type ListingStep } from '../utils/listing-form.ts';
import { useListingWizard } from './listing-context.ts';

export interface ReviewStepProps {
  onSubmit: () => void;
  isSubmitting: boolean;
  /** What the last submit attempt was refused for, by form field (the API's 422 or the check before sending). */
  refusal: { message: string; fields: Record<string, string> } | null;
}

/** Step 5: everything read back with a way to change each part, what is still missing, and the submit button. */
export function ReviewStep({ onSubmit, isSubmitting, refusal }: ReviewStepProps) {
  const wizard = useListingWizard();
  const { units, currency, bundle } = wizard;
  const values = useWatch<ListingFormValues>() as ListingFormValues;
  const { input, errors } = checkListing(values, wizard, 'complete');
  const missing: Record<string, string> = { ...(bundle && bundle.photos.length > 0 ? {} : { photos: 'Add at least one photo.' }), ...errors };
  const refusalRef = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (refusal) refusalRef.current?.focus();
  }, [refusal]);

  const photos = bundle?.photos ?? [];
  const notGiven = <span className="text-thread-soft">Not given yet</span>;
  const yesNo = (flag: boolean | undefined, yes: string, no: string) => (flag ? yes : no);

  return (
    <div className="space-y-6">
      {refusal ? (
        <div ref={refusalRef} tabIndex={-1} className="focus:outline-none">
          <Alert tone="error" title={refusal.message}>
            <ProblemLinks problems={refusal.fields} />
          </Alert>
        </div>
      ) : Object.keys(missing).length > 0 ? (
        <Alert tone="warning" title="Still needed before the librarian can review it" announce={false}>
          <ProblemLinks problems={missing} />
        </Alert>
      ) : (
        <Alert tone="success" title="Everything the librarian needs is here" announce={false}>
          <p>Read it through once more, then submit it for review.</p>
        </Alert>
      )}

      <ReadBack step="photos" title="Photos">
        {photos.length > 0 ? (
          <ul className="flex flex-wrap gap-2">
            {photos.map((photo, index) => (
              <li key={photo.id}>
                <img src={photo.thumbUrl} alt={`Photo ${index + 1} of ${photos.length}`} className="size-20 rounded-stitch object-cover" style={{ backgroundColor: photo.averageHex }} />
              </li>
            ))}
          </ul>
        ) : (
          notGiven
        )}
      </ReadBack>

      <ReadBack step="contents" title="Contents">
        <Facts
          facts={[
            ['Title', input.title ?? notGiven],
            ['Description', input.description ? <span className="whitespace-pre-line">{input.description}</span> : <span className="text-thread-soft">None</span>],
            ['Cut kinds', input.cutKinds?.length ? input.cutKinds.map((kind) => CUT_KIND_LABELS[kind]).join(', ') : notGiven],
            ['Sizes', cutSizesText(input.cutSizes) ?? <span className="text-thread-soft">None ticked</span>],
            ['Fibre', input.fibre ? FIBRE_LABELS[input.fibre] : notGiven],
            ['Colour', [input.colourValue ? COLOUR_VALUE_LABELS[input.colourValue] : null, input.colourFamily ? COLOUR_FAMILY_LABELS[input.colourFamily] : null].filter(Boolean).join(', ') || 'Not chosen'],
            ['Prewashed', yesNo(input.prewashed, 'Yes', 'No')],
            ['Smoke-free home', yesNo(input.smokeFree, 'Yes', 'No')],
            ['Pet-free home', yesNo(input.petFree, 'Yes', 'No: pets live in the home')],
          ]}
        />
      </ReadBack>

      <ReadBack step="weight" title="Weight and pieces">
        <Facts
          facts={[
            ['Weight of one pack', input.weightGrams ? formatWeight(input.weightGrams, units) : notGiven],
            [
              'Pieces',
              input.pieces?.length ? (
                <ul>
                  {input.pieces.map((piece, index) => (
                    <li key={index}>
                      {piece.count} × {pieceSize(piece, units)}
                    </li>
                  ))}
                </ul>
              ) : (
                'None listed'
              ),
            ],
          ]}
        />
      </ReadBack>

      <ReadBack step="offer" title="Offer and price">
        <Facts
          facts={[
            ['Offer', input.offer ? OFFER_LABELS[input.offer] : notGiven],
            ...(input.offer === 'sale'
              ? ([
                  ['Price for one pack', input.priceMinor ? formatMoney(input.priceMinor, currency) : notGiven],
                  ['Meeting handover', yesNo(input.meetingHandoverOk, 'Allowed as well as posting', 'Posting only')],
                ] as Array<[string, ReactNode]>)
              : []),
            ['Packs', input.quantity ? String(input.quantity) : notGiven],
          ]}
        />
      </ReadBack>

      <div className="space-y-2">
        <Button onClick={onSubmit} isPending={isSubmitting} pendingLabel="Submitting…" className="w-full sm:w-auto">
          Submit for review
        </Button>
        <p className="text-thread-soft">The librarian checks every listing before it goes on the shelf. You will get an e-mail either way.</p>
      </div>
    </div>
  );
}

/** Each problem with a link that opens its step and puts focus on the field. */
function ProblemLinks({ problems }: { problems: Record<string, string> }) {
  const { goToStep } = useListingWizard();
  return (
    <ul className="list-disc space-y-1 pl-5">
      {Object.entries(problems).map(([field, message]) => {
        const step: ListingStep = stepOfField(field);
        return (
          <li key={field}>
            <a
              href={`?step=${step}`}
              onClick={(event) => {
                event.preventDefault();
                goToStep(step, field);
              }}
            >
              {fieldLabel(field)}
            </a>
            : {message} <span className="text-thread-soft">({STEP_LABELS[step]})</span>
          </li>
        );
      })}
    </ul>
  );
}

function ReadBack({ step, title, children }: { step: ListingStep; title: string; children: ReactNode }) {
  const { goToStep } = useListingWizard();
  return (
    <section aria-label={title} className="space-y-3 rounded-stitch border-2 border-seam bg-muslin p-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="text-lg font-bold">{title}</h3>
        <Button variant="quiet" onClick={() => goToStep(step)}>
          Change<span className="sr-only"> {title.toLowerCase()}</span>
        </Button>
      </div>
      {children}
    </section>
  );
}

function Facts({ facts }: { facts: Array<[string, ReactNode]> }) {
  return (
    <dl className="grid gap-x-6 sm:grid-cols-[12rem_1fr] sm:gap-y-2 max-sm:[&>dd]:mb-2">
      {facts.map(([term, detail]) => (
        <div key={term} className="contents">
          <dt className="font-semibold text-thread-soft">{term}</dt>
          <dd>{detail}</dd>
        </div>
      ))}
    </dl>
  );
}
