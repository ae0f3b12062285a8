import { ColourSwatch } from "../../../components/ui/colour-swatch";

type InkSwatchProps = {
  hex: string;
  className?: string;
};

/** An ink's reference colour as a patch (decorative; words and numbers go beside it). */
export function InkSwatch({ hex, className = "h-12 w-16" }: InkSwatchProps) {
  return <ColourSwatch hex={hex} className={className} />;
}
