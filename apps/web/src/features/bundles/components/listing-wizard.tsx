import type { BundleView, UnitSystem } from '@scrap-relay/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { FormProvider, useForm, useWatch, type Path } from 'react-hook-form';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Button } from '../../../components/ui/button.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { formatTimeOfDay } from '../../../utils/meetings.ts';
import { useCreateBundle } from '../api/create-bundle.ts';
import { storeBundle } from '../api/get-bundle.ts';
import { useSubmitBundle } from '../api/submit-bundle.ts';
import { useUpdateBundle } from '../api/update-bundle.ts';
import { isUploading, queuePhotoUploads, usePhotoUploads } from '../hooks/use-photo-uploads.ts';
import {
  checkListing,
  formFieldOf,
  formValuesFromBundle,
  isListingStep,
  LISTING_STEPS,
  listingResolver,
  STEP_LABELS,
  stepOfField,
  toDraftInput,
  type ListingFormValues,
  type ListingStep,
} from '../utils/listing-form.ts';
import { ContentsStep } from './contents-step.tsx';
import { ListingWizardContext, type ListingWizardState } from './listing-context.ts';
import { OfferStep } from './offer-step.tsx';
import { PhotoManager } from './photo-manager.tsx';
import { ReviewStep } from './review-step.tsx';
import { StepNav } from './step-nav.tsx';
import { WeightStep } from './weight-step.tsx';

export interface ListingWizardProps {
  /** Null on /my-bundles/new: the first save creates the draft and moves to its edit address. */
  bundle: BundleView | null;
  units: UnitSystem;
  currency: string;
}

/** Pause in typing after which the draft saves itself. */
const AUTOSAVE_AFTER_MS = 1500;

type SaveState =
  | { kind: 'idle' }
  | { kind: 'saving' }
  | { kind: 'saved'; at: Date }
  | { kind: 'invalid' }
  | { kind: 'failed'; message: string };

interface SaveResult {
  ok: boolean;
  bundleId: string | null;
}

/**
 * The listing form in five steps. The draft saves on every step change and
 * after a pause in typing; the review step checks it against what the librarian
 * needs and submits it.
 */
export function ListingWizard({ bundle, units, currency }: ListingWizardProps) {
  const context = useMemo(() => ({ units, currency }), [units, currency]);
  const [search, setSearch] = useSearchParams();
  const requested = search.get('step');
  const step: ListingStep = isListingStep(requested) ? requested : 'photos';
  const navigate = useNavigate();
  const queryClient = useQueryClient();

  // The form starts from the bundle once; later copies of it (after each save) must not overwrite what is being typed.
  const [initial] = useState(() => formValuesFromBundle(bundle, context));
  const resolver = useMemo(() => listingResolver(context), [context]);
  const methods = useForm<ListingFormValues>({ defaultValues: initial, resolver, mode: 'onTouched' });
  const create = useCreateBundle();
  const update = useUpdateBundle();
  const submit = useSubmitBundle();
  const { mutateAsync: createAsync } = create;
  const { mutateAsync: updateAsync } = update;

  const bundleId = bundle?.id ?? null;
  const lastSaved = useRef(JSON.stringify(checkListing(initial, context, 'draft').input));
  const saving = useRef<Promise<SaveResult>>(Promise.resolve({ ok: true, bundleId }));
  const [saveState, setSaveState] = useState<SaveState>({ kind: 'idle' });
  const [refusal, setRefusal] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const uploads = usePhotoUploads(bundleId);

  /** Puts the API's field messages on the form's fields (those the form has), and returns them by form field. */
  const placeApiFields = useCallback(
    (fields: Record<string, string>, pieceRows: number[] = []) => {
      const placed: Record<string, string> = {};
      for (const [apiField, message] of Object.entries(fields)) {
        const field = formFieldOf(apiField, pieceRows);
        placed[field] = message;
        if (field !== 'photos') methods.setError(field as Path<ListingFormValues>, { type: 'server', message });
      }
      return placed;
    },
    [methods],
  );

  /**
   * Saves the draft if it changed. Saves run one after another, so a step change
   * never races the autosave. `create` allows starting the draft (not from the
   * autosave, which must not move a member who is typing to another address).
   */
  const save = useCallback(
    (options: { create: boolean; force?: boolean; showErrors: boolean }): Promise<SaveResult> => {
      const run = async (): Promise<SaveResult> => {
        const values = methods.getValues();
        const { input, errors } = checkListing(values, context, 'draft');
        if (Object.keys(errors).length > 0) {
          if (options.showErrors) await methods.trigger();
          setSaveState({ kind: 'invalid' });
          return { ok: false, bundleId };
        }
        const json = JSON.stringify(input);
        if (json === lastSaved.current && !(options.force && !bundleId)) return { ok: true, bundleId };
        if (!bundleId && !options.create) return { ok: true, bundleId };
        setSaveState({ kind: 'saving' });
        try {
          const { bundle: saved } = bundleId ? await updateAsync({ bundleId, data: input }) : await createAsync(input);
          lastSaved.current = json;
          setSaveState({ kind: 'saved', at: new Date() });
          return { ok: true, bundleId: saved.id };
        } catch (error) {
          if (isApiError(error)) placeApiFields(error.fields, toDraftInput(values, context).pieceRows);
          setSaveState({ kind: 'failed', message: isApiError(error) ? error.message : 'The draft could not be saved.' });
          return { ok: false, bundleId };
        }
      };
      const next = saving.current.then(run, run);
      saving.current = next;
      return next;
    },
    [bundleId, context, createAsync, methods, placeApiFields, updateAsync],
  );

  // Autosave after a pause in typing, once the draft exists.
  const watched = useWatch({ control: methods.control });
  useEffect(() => {
    if (!bundleId) return;
    const timer = setTimeout(() => void save({ create: false, showErrors: false }), AUTOSAVE_AFTER_MS);
    return () => clearTimeout(timer);
  }, [watched, bundleId, save]);

  // Pre-fill the colour from the photos while the seller has not chosen one.
  const suggested = bundle?.colour.suggested ?? null;
  useEffect(() => {
    if (!suggested) return;
    const { colourValue, colourFamily } = methods.getValues();
    if (colourValue === '' && !methods.getFieldState('colourValue').isDirty) methods.setValue('colourValue', suggested.value, { shouldDirty: true });
    if (colourFamily === '' && !methods.getFieldState('colourFamily').isDirty) methods.setValue('colourFamily', suggested.family, { shouldDirty: true });
  }, [suggested, methods]);

  const focusField = useRef<string | null>(null);
  const goToStep = useCallback(
    (next: ListingStep, field?: string) => {
      void (async () => {
        const result = await save({ create: true, showErrors: true });
        if (!result.ok) {
          const firstError = Object.keys(checkListing(methods.getValues(), context, 'draft').errors).find((f) => stepOfField(f) === step);
          // Problems on this step keep the member here; problems elsewhere are listed on the review step.
          if (firstError) {
            focusFormField(firstError);
            return;
          }
        }
        focusField.current = field ?? null;
        setRefusal(null);
        if (!bundleId && result.bundleId) {
          navigate(paths.app.editBundle.getHref(result.bundleId, next), { replace: true });
        } else {
          setSearch({ step: next });
        }
      })();
    },
    [bundleId, context, methods, navigate, save, setSearch, step],
  );

  // On a new step put focus on its heading (or on the field a problem link named), as a new page would.
  const headingRef = useRef<HTMLHeadingElement>(null);
  const firstRender = useRef(true);
  useEffect(() => {
    if (firstRender.current) {
      firstRender.current = false;
      if (!focusField.current) return;
    }
    const field = focusField.current;
    focusField.current = null;
    if (field && focusFormField(field)) return;
    headingRef.current?.focus();
  }, [step]);

  const addFiles = async (files: File[]) => {
    let id = bundleId;
    if (!id) {
      const result = await save({ create: true, force: true, showErrors: false });
      if (!result.bundleId) return;
      id = result.bundleId;
    }
    queuePhotoUploads({ bundleId: id, files, onUploaded: (saved) => storeBundle(queryClient, saved) });
    if (!bundleId) navigate(paths.app.editBundle.getHref(id, 'photos'), { replace: true });
  };

  const saveNow = async () => {
    const result = await save({ create: true, showErrors: true });
    if (!bundleId && result.bundleId) navigate(paths.app.editBundle.getHref(result.bundleId, step), { replace: true });
  };

  const onSubmit = async () => {
    setRefusal(null);
    const values = methods.getValues();
    const saved = await save({ create: true, showErrors: true });
    const { errors } = checkListing(values, context, 'complete');
    const missing: Record<string, string> = {};
    if (!bundle || bundle.photos.length === 0) missing.photos = 'Add at least one photo.';
    Object.assign(missing, errors);
    if (!saved.ok || Object.keys(missing).length > 0 || !saved.bundleId) {
      for (const [field, message] of Object.entries(errors)) methods.setError(field as Path<ListingFormValues>, { type: 'complete', message });
      setRefusal({ message: 'The listing is not complete yet.', fields: missing });
      return;
    }
    try {
      const { bundle: submitted } = await submit.mutateAsync(saved.bundleId);
      navigate(paths.app.bundle.getHref(submitted.id), { state: { submitted: true } });
    } catch (error) {
      if (!isApiError(error)) {
        setRefusal({ message: 'Something went wrong. Please try again.', fields: {} });
        return;
      }
      setRefusal({ message: error.message, fields: placeApiFields(error.fields, toDraftInput(values, context).pieceRows) });
    }
  };

  // Which steps still lack something the librarian needs, for the marks on the step list (`watched`: again as the form changes).
  const needsWork = useMemo(() => {
    const steps = new Set(Object.keys(checkListing(methods.getValues(), context, 'complete').errors).map(stepOfField));
    if (!bundle || bundle.photos.length === 0) steps.add('photos');
    return steps;
  }, [watched, bundle, context, methods]);

  const state: ListingWizardState = { ...context, bundle, goToStep };
  const index = LISTING_STEPS.indexOf(step);
  const previous = LISTING_STEPS[index - 1];
  const following = LISTING_STEPS[index + 1];
  const headingId = `listing-step-${step}`;

  return (
    <ListingWizardContext.Provider value={state}>
      <FormProvider {...methods}>
        <div className="space-y-6">
          <StepNav current={step} needsWork={needsWork} onChoose={goToStep} />
          <form
            noValidate
            aria-labelledby={headingId}
            onSubmit={(event) => {
              event.preventDefault();
              if (following) goToStep(following);
            }}
            className="space-y-6"
          >
            <h2 id={headingId} ref={headingRef} tabIndex={-1} className="text-2xl font-bold focus:outline-none">
              <span className="block text-base font-semibold text-thread-soft">
                Step {index + 1} of {LISTING_STEPS.length}
              </span>
              {STEP_LABELS[step]}
            </h2>
            {step === 'photos' ? <PhotoManager bundle={bundle} onAddFiles={(files) => void addFiles(files)} isStarting={create.isPending} /> : null}
            {step === 'contents' ? <ContentsStep /> : null}
            {step === 'weight' ? <WeightStep /> : null}
            {step === 'offer' ? <OfferStep /> : null}
            {step === 'review' ? <ReviewStep onSubmit={() => void onSubmit()} isSubmitting={submit.isPending} refusal={refusal} /> : null}

            <div className="flex flex-col-reverse gap-3 border-t-2 border-seam pt-4 sm:flex-row sm:items-center sm:justify-between">
              <div className="flex flex-wrap items-center gap-3">
                {previous ? (
                  <Button variant="secondary" onClick={() => goToStep(previous)}>
                    <span aria-hidden="true">←</span> Back: {STEP_LABELS[previous]}
                  </Button>
                ) : null}
                <Button variant="quiet" onClick={() => void saveNow()}>
                  Save draft
                </Button>
              </div>
              {following ? (
                <Button type="submit">
                  Next: {STEP_LABELS[following]} <span aria-hidden="true">→</span>
                </Button>
              ) : null}
            </div>
            <SaveStatus state={saveState} uploading={isUploading(uploads)} />
          </form>
        </div>
      </FormProvider>
    </ListingWizardContext.Provider>
  );
}

/** Focuses the control named `field` on the current step; false when the step has none (e.g. "photos"). */
function focusFormField(field: string): boolean {
  const control = document.querySelector<HTMLElement>(`form [name="${CSS.escape(field)}"]`);
  control?.focus();
  return control !== null;
}

function SaveStatus({ state, uploading }: { state: SaveState; uploading: boolean }) {
  const timeZone = useGuildTimeZone();
  const text =
    state.kind === 'saving'
      ? 'Saving the draft…'
      : state.kind === 'saved'
        ? `Draft saved at ${formatTimeOfDay(state.at.toISOString(), timeZone)}.`
        : state.kind === 'invalid'
          ? 'Not saved yet: fix the fields marked with ✗.'
          : state.kind === 'failed'
            ? `Not saved: ${state.message}`
            : '';
  return (
    <p role="status" className={state.kind === 'failed' || state.kind === 'invalid' ? 'font-semibold text-madder-deep' : 'text-thread-soft'}>
      {text}
      {uploading ? `${text ? ' ' : ''}Photos are still uploading; you can carry on meanwhile.` : ''}
    </p>
  );
}
