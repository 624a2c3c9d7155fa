import { formatMoney, orderCancelSchema, orderPostedSchema, orderProblemSchema, type OrderView } from '@scrap-relay/shared';
import { useId, useState } from 'react';
import { paths } from '../../../config/paths.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, ButtonLink, buttonClass } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { controlClass, FieldError } from '../../../components/ui/field.tsx';
import { Form, SubmitButton, TextField } from '../../../components/ui/form.tsx';
import { useCancelOrder } from '../api/cancel-order.ts';
import { useMarkPosted } from '../api/mark-posted.ts';
import { useMarkReceived } from '../api/mark-received.ts';
import { useRefundOrder } from '../api/refund-order.ts';
import { useReportProblem } from '../api/report-problem.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { formatShortDateTime } from '../../../utils/meetings.ts';
import { TextAreaField } from './text-area-field.tsx';

/** Everything the viewer may do with this order, as the API's `abilities` say; nothing is worked out here. */
export function OrderActions({ order }: { order: OrderView }) {
  const { abilities } = order;
  const slip = order.fulfilment === 'post' && order.viewerIs !== 'buyer' && order.address !== null;
  const any = abilities.pay || abilities.markPosted || abilities.markReceived || abilities.cancel || abilities.refund || abilities.reportProblem || slip;
  if (!any) return null;
  return (
    <div className="space-y-5">
      {abilities.pay && order.checkoutUrl ? <PayAction order={order} checkoutUrl={order.checkoutUrl} /> : null}
      {slip ? (
        <ButtonLink to={paths.app.packingSlip.getHref(order.id)} variant="secondary">
          Print the packing slip
        </ButtonLink>
      ) : null}
      {abilities.markPosted ? <MarkPostedAction order={order} /> : null}
      {abilities.markReceived ? <MarkReceivedAction order={order} /> : null}
      {abilities.reportProblem ? <ReportProblemAction order={order} /> : null}
      {abilities.refund ? <RefundAction order={order} /> : null}
      {abilities.cancel ? <CancelAction order={order} /> : null}
    </div>
  );
}

function PayAction({ order, checkoutUrl }: { order: OrderView; checkoutUrl: string }) {
  const timeZone = useGuildTimeZone();
  return (
    <div className="space-y-2">
      {/* The payment page is the card processor's (another site), so a plain link, not a router link. */}
      <a href={checkoutUrl} className={buttonClass('primary')}>
        Pay {formatMoney(order.chargeMinor, order.currency)} by card
      </a>
      {order.holdExpiresAt ? (
        <p className="text-thread-soft">
          The bundles are held for you until {formatShortDateTime(order.holdExpiresAt, timeZone)}. After that they go back on the shelf and
          this order is cancelled.
        </p>
      ) : null}
    </div>
  );
}

function MarkPostedAction({ order }: { order: OrderView }) {
  const posted = useMarkPosted();
  return (
    <Form
      schema={orderPostedSchema}
      defaultValues={{ trackingNumber: '' }}
      onSubmit={(values) => posted.mutateAsync({ orderId: order.id, data: { trackingNumber: values.trackingNumber || undefined } })}
      className="space-y-4 rounded-stitch border-2 border-seam bg-linen p-4"
    >
      <TextField
        name="trackingNumber"
        label="Tracking number (optional)"
        hint={`${order.buyer.name} gets it by e-mail with the news that the parcel is on its way.`}
        autoComplete="off"
        spellCheck={false}
      />
      <SubmitButton pendingLabel="Saving…">Mark as posted</SubmitButton>
    </Form>
  );
}

/** Asked before it is done: saying a parcel arrived cannot be taken back, and ends the order for the seller. */
function MarkReceivedAction({ order }: { order: OrderView }) {
  const [open, setOpen] = useState(false);
  const received = useMarkReceived({ onSuccess: () => setOpen(false) });
  const count = order.items.reduce((sum, item) => sum + item.quantity, 0);
  return (
    <div className="space-y-2">
      <Button onClick={() => setOpen(true)}>Mark as received</Button>
      <p className="text-thread-soft">{order.seller.name} is told it arrived safely.</p>
      <ConfirmDialog
        open={open}
        title={`Has the parcel from ${order.seller.name} arrived?`}
        confirmLabel="Yes, mark it received"
        cancelLabel="Not yet"
        pendingLabel="Saving…"
        isPending={received.isPending}
        onCancel={() => setOpen(false)}
        onConfirm={() => received.mutate(order.id)}
      >
        <p>
          Open it first and check the {count === 1 ? 'bundle is' : `${count} bundles are`} there. {order.seller.name} is e-mailed that it arrived
          safely, and this cannot be undone.
        </p>
        <p>Something missing, damaged or not as described? You can still report a problem with this order afterwards.</p>
        {received.isError ? (
          <p role="alert" className="font-semibold text-madder-deep">
            {received.error.message}
          </p>
        ) : null}
      </ConfirmDialog>
    </div>
  );
}

function ReportProblemAction({ order }: { order: OrderView }) {
  const report = useReportProblem();
  const [sent, setSent] = useState(false);
  return (
    <details className="rounded-stitch border-2 border-seam bg-muslin p-3">
      <summary className="min-h-11 cursor-pointer py-2 font-semibold">Report a problem with this order</summary>
      <div className="space-y-3 pt-2">
        <p className="text-thread-soft">
          Something missing, damaged or not as described? Tell the guild’s treasurer here: they see it on this order and can refund the payment.
          The seller is told that you reported a problem, not what you wrote.
        </p>
        <Form
          schema={orderProblemSchema}
          defaultValues={{ message: '' }}
          onSubmit={async (values, methods) => {
            setSent(false);
            await report.mutateAsync({ orderId: order.id, data: values });
            methods.reset({ message: '' });
            setSent(true);
          }}
          className="space-y-4"
        >
          <TextAreaField name="message" label="What went wrong" />
          <SubmitButton pendingLabel="Sending…" variant="secondary">
            Send the report
          </SubmitButton>
          {sent ? <Alert tone="success" title="Your report is on the order for the treasurer" /> : null}
        </Form>
      </div>
    </details>
  );
}

function RefundAction({ order }: { order: OrderView }) {
  const [open, setOpen] = useState(false);
  const refund = useRefundOrder({ onSuccess: () => setOpen(false) });
  const amount = formatMoney(order.chargeMinor, order.currency);
  return (
    <div>
      <Button variant="danger" onClick={() => setOpen(true)}>
        Refund {amount}
      </Button>
      <ConfirmDialog
        open={open}
        title={`Refund ${amount} to ${order.buyer.name}?`}
        confirmLabel={`Refund ${amount}`}
        pendingLabel="Refunding…"
        confirmVariant="danger"
        isPending={refund.isPending}
        onCancel={() => setOpen(false)}
        onConfirm={() => refund.mutate(order.id)}
      >
        <p>The whole payment goes back to the card it was paid with, and the ledger entries for this order are reversed.</p>
        <p>
          {order.state === 'confirmed'
            ? 'The bundles have not been posted, so they go back on the shelf.'
            : 'The bundles were already sent, so they stay rehomed.'}
        </p>
        <SellerOwingNote order={order} />
        {refund.isError ? (
          <p role="alert" className="font-semibold text-madder-deep">
            {refund.error.message}
          </p>
        ) : null}
      </ConfirmDialog>
    </div>
  );
}

/**
 * Said before a refund that takes back more than the guild may still pay the seller, because part was paid out
 * already. A refund of a bag not yet sent changes nothing here: its credit was waiting and was never paid out.
 */
function SellerOwingNote({ order }: { order: OrderView }) {
  const effect = order.refundEffect;
  if (!effect) return null;
  const afterMinor = effect.sellerPayableAfterMinor;
  if (afterMinor >= 0 || afterMinor >= effect.sellerPayableMinor) return null;
  const money = (minor: number) => formatMoney(minor, order.currency);
  const name = order.seller.name;
  return (
    <Alert
      tone="warning"
      announce={false}
      title={effect.sellerPayableMinor < 0 ? `${name} already owes the guild ${money(-effect.sellerPayableMinor)}` : `${name} has been paid out already`}
    >
      <p>After this refund they will owe the guild {money(-afterMinor)}, which comes off their next sales.</p>
    </Alert>
  );
}

function CancelAction({ order }: { order: OrderView }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const cancel = useCancelOrder({ onSuccess: () => setOpen(false) });
  const reasonId = useId();
  // After a lost dispute the buyer's bank has returned the money already: cancelling refunds nothing more.
  const takenBack = order.dispute?.stage === 'lost';
  const paid = order.state === 'confirmed' && order.chargeMinor > 0 && !takenBack;

  const confirm = () => {
    const parsed = orderCancelSchema.safeParse({ reason: reason.trim() || undefined });
    if (!parsed.success) {
      setProblem(parsed.error.issues[0]?.message ?? 'This reason cannot be sent.');
      return;
    }
    setProblem(null);
    cancel.mutate({ orderId: order.id, data: parsed.data });
  };

  return (
    <div>
      <Button variant="secondary" onClick={() => setOpen(true)}>
        Cancel this order
      </Button>
      <ConfirmDialog
        open={open}
        title={`Cancel order ${order.reference}?`}
        confirmLabel="Cancel the order"
        cancelLabel="Keep the order"
        pendingLabel="Cancelling…"
        confirmVariant="danger"
        isPending={cancel.isPending}
        onCancel={() => setOpen(false)}
        onConfirm={confirm}
      >
        <p>
          {paid
            ? `The card payment of ${formatMoney(order.chargeMinor, order.currency)} is refunded in full, and the bundles go back on the shelf.`
            : takenBack
              ? 'The buyer’s bank has already returned the payment, so nothing more is refunded. The bundles go back on the shelf.'
              : 'Nothing has been charged. The bundles go back on the shelf.'}
        </p>
        <div className="space-y-1.5">
          <label htmlFor={reasonId} className="block font-semibold">
            Reason (optional, both of you see it)
          </label>
          <textarea
            id={reasonId}
            rows={3}
            value={reason}
            onChange={(event) => setReason(event.target.value)}
            aria-invalid={problem ? true : undefined}
            aria-describedby={problem ? `${reasonId}-error` : undefined}
            className={controlClass}
          />
          {problem ? <FieldError id={`${reasonId}-error`}>{problem}</FieldError> : null}
        </div>
        {cancel.isError ? (
          <p role="alert" className="font-semibold text-madder-deep">
            {cancel.error.message}
          </p>
        ) : null}
      </ConfirmDialog>
    </div>
  );
}
