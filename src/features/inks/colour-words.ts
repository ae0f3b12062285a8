// Colour words moved to src/lib so every feature can give colour in words; kept here for imports.
export { colourWords } from "../../lib/colour-words";
