type InkSwatchProps = {
  hex: string;
  className?: string;
};

/**
 * The colour patch itself. Always decorative: the ink's colour words and numbers sit beside it
 * as text, so nobody depends on seeing the patch.
 */
export function InkSwatch({ hex, className = "h-12 w-16" }: InkSwatchProps) {
  return <div aria-hidden="true" className={`swatch-ink shrink-0 rounded-md ${className}`} style={{ backgroundColor: hex }} />;
}
