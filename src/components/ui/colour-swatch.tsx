type ColourSwatchProps = {
  hex: string;
  className?: string;
};

/**
 * A patch of colour. Always decorative: the colour's words and numbers sit beside it as text,
 * so nobody depends on seeing the patch.
 */
export function ColourSwatch({ hex, className = "h-12 w-16" }: ColourSwatchProps) {
  return <div aria-hidden="true" className={`swatch-ink shrink-0 rounded-md ${className}`} style={{ backgroundColor: hex }} />;
}
