import { countryName, type PostalAddress } from '@scrap-relay/shared';

/** A postal address as it goes on an envelope, one line each, the country by name. */
export function PostalAddressLines({ address }: { address: PostalAddress }) {
  const lines = [
    address.name,
    address.line1,
    address.line2,
    [address.town, address.region].filter(Boolean).join(', '),
    address.postalCode,
    countryName(address.country) ?? address.country,
  ].filter(Boolean);
  return (
    <address className="not-italic leading-snug">
      {lines.map((line, index) => (
        <span key={index} className="block">
          {line}
        </span>
      ))}
    </address>
  );
}
