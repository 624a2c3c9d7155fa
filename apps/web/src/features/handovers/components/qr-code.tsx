/** The QR code our API drew for a handover (an SVG string), shown as an image so no markup is injected into the page. */
export function QrCode({ svg, label, className }: { svg: string; label: string; className?: string }) {
  return <img src={`data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`} alt={label} className={className} />;
}
