import { cn } from '../../../utils/cn.ts';
import { LISTING_STEPS, STEP_LABELS, type ListingStep } from '../utils/listing-form.ts';

/**
 * The five steps as links (any step can be opened, the draft saves on the way).
 * Phones show numbers with the current step's name; wider screens every name.
 */
export interface StepNavProps {
  current: ListingStep;
  /** Steps with something the librarian still needs; the others are marked complete. */
  needsWork: ReadonlySet<ListingStep>;
  onChoose: (step: ListingStep) => void;
}

export function StepNav({ current, needsWork, onChoose }: StepNavProps) {
  return (
    <nav aria-label="Listing steps">
      <ol className="grid grid-cols-5 gap-1 sm:gap-2">
        {LISTING_STEPS.map((step, index) => {
          const isCurrent = step === current;
          const complete = step !== 'review' && !needsWork.has(step);
          return (
            <li key={step} className="min-w-0">
              <a
                href={`?step=${step}`}
                aria-current={isCurrent ? 'step' : undefined}
                onClick={(event) => {
                  event.preventDefault();
                  if (!isCurrent) onChoose(step);
                }}
                className={cn(
                  'flex min-h-11 flex-col items-center gap-1 rounded-stitch border-2 px-1 py-2 text-center no-underline sm:flex-row sm:px-3 sm:text-left',
                  isCurrent ? 'border-thread bg-thread text-white hover:text-white' : 'border-seam bg-muslin text-thread hover:bg-linen-deep hover:text-thread',
                )}
              >
                <span
                  aria-hidden="true"
                  className={cn(
                    'flex size-7 shrink-0 items-center justify-center rounded-full border-2 font-bold',
                    isCurrent ? 'border-white' : complete ? 'border-sage bg-sage-wash text-sage' : 'border-selvage',
                  )}
                >
                  {complete && !isCurrent ? '✓' : index + 1}
                </span>
                <span className="max-sm:sr-only font-semibold leading-tight">
                  {STEP_LABELS[step]}
                  {step === 'review' ? null : <span className="sr-only">{complete ? ' (complete)' : ' (still needs details)'}</span>}
                </span>
              </a>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
