import type { BundleView } from '@scrap-relay/shared';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { useSubmitBundle } from '../api/submit-bundle.ts';
import { useWithdrawBundle } from '../api/withdraw-bundle.ts';

/** Words for the edit link by state: a draft is finished, a returned bundle fixed. */
function editLabel(bundle: BundleView): string {
  if (bundle.state === 'draft') return 'Continue listing';
  if (bundle.state === 'returned') return 'Fix and resubmit';
  return 'Edit';
}

/**
 * What the seller may do with a bundle, exactly as its `abilities` say: edit,
 * submit for review (relist for a withdrawn or expired one), withdraw.
 */
export function SellerActions({ bundle, showEdit = true }: { bundle: BundleView; showEdit?: boolean }) {
  const submit = useSubmitBundle();
  const withdraw = useWithdrawBundle();
  const [confirmingWithdraw, setConfirmingWithdraw] = useState(false);
  const { abilities } = bundle;
  const name = bundle.title || 'untitled draft';
  const incomplete = submit.error?.status === 422;

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-2">
        {showEdit && abilities.edit ? (
          <ButtonLink to={paths.app.editBundle.getHref(bundle.id, bundle.state === 'returned' ? 'review' : null)} variant="secondary">
            {editLabel(bundle)}
            <span className="sr-only">: {name}</span>
          </ButtonLink>
        ) : null}
        {abilities.submit && bundle.state !== 'returned' ? (
          <Button onClick={() => submit.mutate(bundle.id)} isPending={submit.isPending} pendingLabel="Sending…">
            {abilities.relist ? 'Relist' : 'Submit for review'}
            <span className="sr-only">: {name}</span>
          </Button>
        ) : null}
        {abilities.withdraw ? (
          <Button variant="quiet" onClick={() => setConfirmingWithdraw(true)}>
            Withdraw<span className="sr-only">: {name}</span>
          </Button>
        ) : null}
      </div>
      {submit.isError ? (
        <p role="alert" className="font-semibold text-madder-deep">
          <span aria-hidden="true">✗ </span>
          {incomplete ? 'The listing is not complete yet. ' : `${submit.error.message} `}
          {incomplete ? <Link to={paths.app.editBundle.getHref(bundle.id, 'review')}>See what is missing</Link> : null}
        </p>
      ) : null}
      {submit.isSuccess ? (
        <p role="status" className="font-semibold text-sage">
          <span aria-hidden="true">✓ </span>Sent to the librarian for review.
        </p>
      ) : null}
      {confirmingWithdraw ? (
        <ConfirmDialog
          open
          title={`Withdraw “${name}”?`}
          confirmLabel="Withdraw"
          pendingLabel="Withdrawing…"
          confirmVariant="danger"
          isPending={withdraw.isPending}
          onCancel={() => setConfirmingWithdraw(false)}
          onConfirm={() => withdraw.mutate(bundle.id, { onSuccess: () => setConfirmingWithdraw(false) })}
        >
          <p>
            {bundle.state === 'on_shelf' ? 'It comes off the shelf straight away. ' : ''}
            You can edit it and relist it later; it then goes through review again.
          </p>
          {withdraw.isError ? (
            <p role="alert" className="font-semibold text-madder-deep">
              {withdraw.error.message}
            </p>
          ) : null}
        </ConfirmDialog>
      ) : null}
    </div>
  );
}
