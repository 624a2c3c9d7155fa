import { COLOUR_FAMILY_LABELS, COLOUR_VALUE_LABELS, parseHex, suggestColour } from '@scrap-relay/shared';
import { cn } from '../utils/cn.ts';

/** A photo's average colour in words, value then family as the listing form words its suggestion: "medium, warm". Null when it is not a colour code. */
export function colourWords(hex: string): string | null {
  const rgb = parseHex(hex);
  if (!rgb) return null;
  const { family, value } = suggestColour(rgb);
  return `${COLOUR_VALUE_LABELS[value].toLowerCase()}, ${COLOUR_FAMILY_LABELS[family].toLowerCase()}`;
}

export interface ColourSwatchProps {
  /** The colour as the photo pipeline gives it ("#cd5d33"); never shown as text. */
  hex: string;
  /** What the colour is of, the start of the swatch's name: "average colour of the photos". */
  of?: string;
  className?: string;
}

/**
 * A small patch of a colour, named in words for screen readers and on hover ("average colour of the photos:
 * medium, warm"). Members see the colour itself, never its code.
 */
export function ColourSwatch({ hex, of = 'average colour of the photos', className }: ColourSwatchProps) {
  const words = colourWords(hex);
  const name = words ? `${of}: ${words}` : of;
  return (
    <span
      role="img"
      aria-label={name}
      title={name}
      className={cn('inline-block size-5 shrink-0 rounded border border-selvage', className)}
      style={{ backgroundColor: words ? hex : undefined }}
    />
  );
}
