import { formatWeight, type OrderView, type PostalAddress, type UnitSystem } from '@scrap-relay/shared';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { PrintFrame } from '../../../components/print-frame.tsx';
import { useDocumentTitle } from '../../../hooks/use-document-title.ts';
import { isApiError } from '../../../lib/api-client.ts';
import { formatDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { usePackingSlip } from '../api/get-packing-slip.ts';
import { useSenderAddress } from '../api/get-sender-address.ts';
import { AddressBlock } from './order-details.tsx';

/** SVG from our own API (the qrcode library's output), shown as an image so no markup is ever injected into the page. */
const svgDataUrl = (svg: string) => `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;

export function PackingSlip({ orderId, guildName, units }: { orderId: string; guildName: string; units: UnitSystem }) {
  const slip = usePackingSlip(orderId);
  const reference = slip.data?.order.reference;
  useDocumentTitle(reference ? `Packing slip ${reference}` : 'Packing slip');
  const sender = useSenderAddress(slip.data?.order.viewerIs === 'seller');

  if (slip.isPending) return <Loading label="Preparing the packing slip…" />;
  if (slip.isError) {
    return (
      <div className="mx-auto max-w-xl space-y-4">
        <h1 tabIndex={-1} data-page-heading="" className="text-3xl font-bold focus:outline-none">
          Packing slip
        </h1>
        <Alert tone="error" title="The packing slip is not available">
          <p>{isApiError(slip.error) && slip.error.status === 403 ? 'The slip carries the buyer’s address, so it opens only for the seller once the order is paid.' : slip.error.message}</p>
        </Alert>
        <Link to={paths.app.order.getHref(orderId)}>Back to the order</Link>
      </div>
    );
  }

  const { order, qrSvg } = slip.data;
  return (
    // The frame leaves the app's header, menu and footer off the printout and prints in black only.
    <PrintFrame className="mx-auto max-w-3xl">
      <div className="space-y-6">
        <div className="space-y-3 print:hidden">
          <Link to={paths.app.order.getHref(order.id)}>← Back to order {order.reference}</Link>
          <p>Print this page and put the slip in the parcel, or tape it to the outside. Only the slip is printed, in black and white.</p>
          <Button onClick={() => window.print()}>Print the packing slip</Button>
        </div>
        <SlipSheet order={order} qrSvg={qrSvg} guildName={guildName} units={units} from={sender.data?.address ?? null} />
      </div>
    </PrintFrame>
  );
}

function SlipSheet({ order, qrSvg, guildName, units, from }: { order: OrderView; qrSvg: string; guildName: string; units: UnitSystem; from: PostalAddress | null }) {
  const totalGrams = order.items.reduce((sum, item) => sum + item.weightGrams * item.quantity, 0);
  const timeZone = useGuildTimeZone();
  return (
    <article aria-labelledby="packing-slip-title" className="space-y-6 rounded-stitch border-2 border-thread bg-white p-6 text-thread sm:p-8 print:max-w-[180mm] print:border-0 print:p-0">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="space-y-1">
          <p className="font-semibold">{guildName} · Scrap Relay</p>
          <h1 id="packing-slip-title" tabIndex={-1} data-page-heading="" className="text-3xl font-bold focus:outline-none">
            Packing slip
          </h1>
          <p className="text-2xl font-bold tracking-wider">{order.reference}</p>
          <p>Ordered {formatDate(order.createdAt, timeZone)}</p>
        </div>
        <img src={svgDataUrl(qrSvg)} alt={`QR code of the order reference ${order.reference}`} width={128} height={128} className="size-32 shrink-0" />
      </div>

      <div className="grid gap-6 sm:grid-cols-2 print:grid-cols-2">
        {order.address ? <AddressBlock label="To" address={order.address} /> : null}
        {from ? (
          <AddressBlock label="From" address={from} />
        ) : (
          <div className="leading-snug">
            <p className="font-semibold">From</p>
            <p>{order.seller.name}</p>
            <p>a member of {guildName}</p>
          </div>
        )}
      </div>

      {/* A weight stays on one line ("1 lb 8 oz"); on a phone the bundle titles wrap instead. */}
      <table className="w-full border-collapse">
        <caption className="sr-only">Bundles in this parcel</caption>
        <thead>
          <tr className="border-b-2 border-thread text-left print:border-black">
            <th scope="col" className="py-2 pr-3">
              Bundle
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              How many
            </th>
            <th scope="col" className="py-2 pl-3 text-right">
              Weight
            </th>
          </tr>
        </thead>
        <tbody>
          {order.items.map((item) => (
            <tr key={item.bundleId} className="border-b border-seam print:border-black">
              <td className="py-2 pr-3">{item.title}</td>
              <td className="px-3 py-2 text-right">{item.quantity}</td>
              <td className="py-2 pl-3 text-right whitespace-nowrap">{formatWeight(item.weightGrams * item.quantity, units)}</td>
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr>
            <th scope="row" colSpan={2} className="py-2 pr-3 text-right">
              Fabric in total
            </th>
            <td className="py-2 pl-3 text-right font-bold whitespace-nowrap">{formatWeight(totalGrams, units)}</td>
          </tr>
        </tfoot>
      </table>

      <div className="space-y-1 border-t-2 border-thread pt-4 print:border-black">
        <p>
          <strong>Before sealing:</strong> check every pin and needle is out.
        </p>
        <p>
          {order.buyer.name}: when it arrives, open order {order.reference} in Scrap Relay and mark it received.
        </p>
      </div>
    </article>
  );
}
