// Invented strip posts for the demo seed. Every ink reference names an ink in demoInks
// (catalogue.ts) by brand slug and ink name, listed in ink order from the left end of the
// strip. In strips of three or more inks the lightest ink sits between darker ones, the way
// crafters lay out a blend so each dark ink only meets a light one (common practice).

export type DemoPaper = "smooth-cardstock" | "hot-press" | "cold-press" | "mixed-media" | "other";
export type DemoTool = "blending-brush" | "foam" | "dauber" | "sponge" | "other";

export interface DemoInkRef {
  /** brand slug from demoBrands */
  brand: string;
  /** ink name within that brand */
  name: string;
}

export interface DemoStripIdea {
  title: string;
  /** plain text, no markup */
  notes: string;
  paper: DemoPaper;
  tools: DemoTool[];
  /** e-mail of an account in demoMembers */
  authorEmail: string;
  /** 2–5 inks in ink order */
  inks: DemoInkRef[];
}

export const demoStripIdeas: DemoStripIdea[] = [
  {
    title: "Harbour lights at closing time",
    notes:
      "Navy first, then the yellow pounced in from the middle outwards so it stays clean. Orange last, worked back into the yellow in small circles.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "mara@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Deep Sounding" },
      { brand: "tidewick", name: "Lighthouse Lamp" },
      { brand: "tidewick", name: "Buoy Orange" },
    ],
  },
  {
    title: "Moorland in late August",
    notes:
      "All one maker. The oatcake band is there to stop the purple and the moss green turning grey where they meet.",
    paper: "hot-press",
    tools: ["blending-brush"],
    authorEmail: "elke@blendwell.test",
    inks: [
      { brand: "brackenfold", name: "Sloe Bramble" },
      { brand: "brackenfold", name: "Heather Moor" },
      { brand: "brackenfold", name: "Oatcake" },
      { brand: "brackenfold", name: "Mossbank" },
    ],
  },
  {
    title: "Berry tart with cream in the middle",
    notes:
      "Pigment pads, so I let each layer dry for a minute before going back in. The pale pink took three passes to cover evenly.",
    paper: "smooth-cardstock",
    tools: ["foam"],
    authorEmail: "jonah@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Blackcurrant Cordial" },
      { brand: "ostrelle", name: "Raspberry Coulis" },
      { brand: "ostrelle", name: "Strawberry Milk" },
      { brand: "ostrelle", name: "Rhubarb Fool" },
    ],
  },
  {
    title: "Galaxy belt, take three",
    notes:
      "Third try at this one. Keeping the icy blue narrow is the trick; too wide and the whole strip looks washed out. Flicked water over it once dry.",
    paper: "smooth-cardstock",
    tools: ["blending-brush", "other"],
    authorEmail: "femi@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Polar Night" },
      { brand: "kelpforth", name: "Cobalt Lantern" },
      { brand: "kelpforth", name: "Glacier Melt" },
      { brand: "kelpforth", name: "Amethyst Geode" },
    ],
  },
  {
    title: "Rust and rain",
    notes:
      "Orange and blue fight, so the cream sits between them as a buffer. Sponged on cold-press, which gives a nice speckle.",
    paper: "cold-press",
    tools: ["sponge"],
    authorEmail: "ruth@blendwell.test",
    inks: [
      { brand: "brackenfold", name: "Bracken Rust" },
      { brand: "brackenfold", name: "Oatcake" },
      { brand: "brackenfold", name: "Rain Barrel" },
      { brand: "brackenfold", name: "Slate Roof" },
    ],
  },
  {
    title: "Sunrise over the salt flat",
    notes:
      "Five inks on a slimline strip. The off-white pigment goes down last and gets buffed in with a clean dauber so it softens the yellow edge.",
    paper: "mixed-media",
    tools: ["blending-brush", "dauber"],
    authorEmail: "priya@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Magma Glow" },
      { brand: "kelpforth", name: "Amber Quarry" },
      { brand: "kelpforth", name: "Citrine Ledge" },
      { brand: "kelpforth", name: "Salt Flat" },
      { brand: "kelpforth", name: "Glacier Melt" },
    ],
  },
  {
    title: "Are these two yellows the same?",
    notes:
      "Bought the second pad by accident. Blended them end to end and I honestly cannot find the join. Posting so nobody else buys both.",
    paper: "smooth-cardstock",
    tools: ["foam"],
    authorEmail: "ruth@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Lighthouse Lamp" },
      { brand: "kelpforth", name: "Citrine Ledge" },
    ],
  },
  {
    title: "Pine forest after rain",
    notes:
      "Deep green at both ends, pale lichen in the centre for the light coming through. Cold-press soaks up more ink, so go lightly.",
    paper: "cold-press",
    tools: ["blending-brush"],
    authorEmail: "ivo@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Malachite Deep" },
      { brand: "brackenfold", name: "Lichen Stone" },
      { brand: "brackenfold", name: "Fern Shadow" },
    ],
  },
  {
    title: "Peach melba",
    notes: "Quick one for a birthday card background. Custard in the middle keeps the raspberry from going brown next to the apricot.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "mara@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Raspberry Coulis" },
      { brand: "ostrelle", name: "Custard Tart" },
      { brand: "ostrelle", name: "Apricot Glaze" },
    ],
  },
  {
    title: "Slate, fog and sea fret",
    notes: "A grey ladder for shading stamped boats. Dark, light, middle, so the eye reads it as weather rather than a gradient.",
    paper: "smooth-cardstock",
    tools: ["foam"],
    authorEmail: "elke@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Squall Line" },
      { brand: "tidewick", name: "Sea Fret" },
      { brand: "tidewick", name: "Harbour Fog" },
    ],
  },
  {
    title: "Coral reef shallows",
    notes: "My first four-ink strip. The pale aqua is doing a lot of work between the teal and the coral.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "noor@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Riptide" },
      { brand: "tidewick", name: "Breaker Foam" },
      { brand: "tidewick", name: "Shrimp Net" },
      { brand: "tidewick", name: "Sunset Pier" },
    ],
  },
  {
    title: "Plum orchard at dusk",
    notes: "Mixed three makers here. The violet pigment sits on top of the dye and stays chalky, which I like for skies.",
    paper: "hot-press",
    tools: ["blending-brush"],
    authorEmail: "femi@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Plum Jam" },
      { brand: "ostrelle", name: "Violet Cream" },
      { brand: "tidewick", name: "Dusk Over Water" },
      { brand: "kelpforth", name: "Polar Night" },
    ],
  },
  {
    title: "Autumn hedge, no mud",
    notes:
      "Kept the straw band wide so the orange never touches the green. Demo strip from Thursday's class: everyone got the same four pads.",
    paper: "mixed-media",
    tools: ["blending-brush"],
    authorEmail: "priya@blendwell.test",
    inks: [
      { brand: "brackenfold", name: "Brick Kiln" },
      { brand: "brackenfold", name: "Kindling Orange" },
      { brand: "brackenfold", name: "Hayloft Straw" },
      { brand: "brackenfold", name: "Hedgerow Green" },
    ],
  },
  {
    title: "Chocolate orange",
    notes: "Brown into orange with apricot as the go-between. The brown pigment needed a heat gun before I could blend over it.",
    paper: "smooth-cardstock",
    tools: ["foam"],
    authorEmail: "jonah@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Cocoa Nib" },
      { brand: "ostrelle", name: "Apricot Glaze" },
      { brand: "ostrelle", name: "Blood Orange Peel" },
    ],
  },
  {
    title: "Glacier lake",
    notes: "Blue to green through almost-white. Worked in very small circles along each join and it came out seamless.",
    paper: "hot-press",
    tools: ["blending-brush"],
    authorEmail: "elke@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Fjord Blue" },
      { brand: "kelpforth", name: "Glacier Melt" },
      { brand: "kelpforth", name: "Aurora Veil" },
      { brand: "kelpforth", name: "Malachite Deep" },
    ],
  },
  {
    title: "Rosehip and heather",
    notes: "Soft vintage look for a wedding card. A pale pink between the two stronger colours keeps it gentle.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "mara@blendwell.test",
    inks: [
      { brand: "brackenfold", name: "Rosehip Jelly" },
      { brand: "brackenfold", name: "Hawthorn Blossom" },
      { brand: "brackenfold", name: "Heather Moor" },
    ],
  },
  {
    title: "Mint chocolate chip",
    notes: "Pigment on pigment. Let it dry fully or the mint lifts the brown.",
    paper: "smooth-cardstock",
    tools: ["dauber"],
    authorEmail: "jonah@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Cocoa Nib" },
      { brand: "ostrelle", name: "Mint Fondant" },
      { brand: "ostrelle", name: "Spearmint Tin" },
    ],
  },
  {
    title: "Sunset without the neon",
    notes:
      "I wanted a sunset that does not glow. Deep purple, a berry pink, then yellow as the light band and orange at the end.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "femi@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Urchin Spine" },
      { brand: "tidewick", name: "Anemone Bloom" },
      { brand: "tidewick", name: "Lighthouse Lamp" },
      { brand: "tidewick", name: "Buoy Orange" },
    ],
  },
  {
    title: "Three greys for shading",
    notes: "Reference strip for stamped stones and pebbles. The light grey in the middle makes the two darker ones read as different.",
    paper: "smooth-cardstock",
    tools: ["foam"],
    authorEmail: "admin@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Basalt Column" },
      { brand: "kelpforth", name: "Moonlit Tin" },
      { brand: "kelpforth", name: "Ash Plain" },
    ],
  },
  {
    title: "Thunderhead over barley",
    notes:
      "Blue next to yellow always goes a bit green; here that is the point, it reads as grass. Finished with a mustard edge.",
    paper: "cold-press",
    tools: ["blending-brush", "sponge"],
    authorEmail: "ivo@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Storm Petrel" },
      { brand: "brackenfold", name: "Rain Barrel" },
      { brand: "brackenfold", name: "Hayloft Straw" },
      { brand: "brackenfold", name: "Mustard Crock" },
    ],
  },
  {
    title: "Cider Press is gone, which ochre now?",
    notes:
      "My favourite pad was discontinued, so I put the last of it between two candidates. Both are close enough that I will stop hunting.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "ruth@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Ochre Cliff" },
      { brand: "brackenfold", name: "Cider Press" },
      { brand: "ostrelle", name: "Caramel Drizzle" },
    ],
  },
  {
    title: "Cranberry and spruce",
    notes: "Christmas colours without the usual clash: a pale almond band stops red and green from meeting.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "elke@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Cherry Compote" },
      { brand: "ostrelle", name: "Sugared Almond" },
      { brand: "kelpforth", name: "Malachite Deep" },
    ],
  },
  {
    title: "Lavender field in July",
    notes: "Purple rows into green stems. The pistachio and the lavender are nearly the same lightness, so the join is very soft.",
    paper: "hot-press",
    tools: ["blending-brush"],
    authorEmail: "priya@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Amethyst Geode" },
      { brand: "ostrelle", name: "Lavender Shortbread" },
      { brand: "ostrelle", name: "Pistachio Gelato" },
      { brand: "brackenfold", name: "Hedgerow Green" },
    ],
  },
  {
    title: "Tea-stained letters",
    notes: "For a journal page. Sponged, then crumpled the strip and rubbed the darkest brown over the creases.",
    paper: "mixed-media",
    tools: ["sponge"],
    authorEmail: "priya@blendwell.test",
    inks: [
      { brand: "brackenfold", name: "Chestnut Husk" },
      { brand: "brackenfold", name: "Oatcake" },
      { brand: "tidewick", name: "Driftwood Pale" },
      { brand: "brackenfold", name: "Ploughed Field" },
    ],
  },
  {
    title: "Tidal pool at noon",
    notes: "Teal to green through the palest aqua. Used a fresh brush for the foam colour so it stayed clean.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "mara@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Tidewater Teal" },
      { brand: "tidewick", name: "Lagoon Shallows" },
      { brand: "tidewick", name: "Breaker Foam" },
      { brand: "tidewick", name: "Rockpool Green" },
    ],
  },
  {
    title: "Cherry blossom sky",
    notes: "Soft blue into pink. The blossom pink is so pale it barely shows on its own but it carries the blend.",
    paper: "smooth-cardstock",
    tools: ["foam"],
    authorEmail: "noor@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Mackerel Sky" },
      { brand: "brackenfold", name: "Hawthorn Blossom" },
      { brand: "tidewick", name: "Thrift Cushion" },
    ],
  },
  {
    title: "Two near-blacks side by side",
    notes: "Checking whether I need both in the stash. Under daylight I could only tell them apart at a steep angle.",
    paper: "smooth-cardstock",
    tools: ["dauber"],
    authorEmail: "ivo@blendwell.test",
    inks: [
      { brand: "brackenfold", name: "Chimney Soot" },
      { brand: "ostrelle", name: "Liquorice Twist" },
    ],
  },
  {
    title: "Volcano cross-section",
    notes:
      "Five inks, dark at both ends with the glow in the middle. The black pigment goes on last with a dauber, only at the very edge.",
    paper: "mixed-media",
    tools: ["blending-brush", "dauber"],
    authorEmail: "femi@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Volcanic Glass" },
      { brand: "kelpforth", name: "Cinnabar Seam" },
      { brand: "kelpforth", name: "Magma Glow" },
      { brand: "kelpforth", name: "Amber Quarry" },
      { brand: "kelpforth", name: "Basalt Column" },
    ],
  },
  {
    title: "Gingerbread house window",
    notes: "Warm glow between two browns. Made before the saffron pad was discontinued, sadly.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "mara@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Burnt Sugar" },
      { brand: "ostrelle", name: "Saffron Bun" },
      { brand: "ostrelle", name: "Gingerbread" },
    ],
  },
  {
    title: "Bluebells under the birches",
    notes: "Blue into dark fern with a soft grey between them for the bark. Good under white-embossed flowers.",
    paper: "hot-press",
    tools: ["blending-brush"],
    authorEmail: "ivo@blendwell.test",
    inks: [
      { brand: "brackenfold", name: "Bluebell Wood" },
      { brand: "brackenfold", name: "Dovecote" },
      { brand: "brackenfold", name: "Fern Shadow" },
    ],
  },
  {
    title: "Night harbour for a lighthouse card",
    notes: "Navy, a paler blue band where the beam will go, then the deepest blue. Die-cut the lighthouse from black card.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "femi@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Trawler Navy" },
      { brand: "tidewick", name: "Spindrift Blue" },
      { brand: "tidewick", name: "Deep Sounding" },
    ],
  },
  {
    title: "Two reds, one pad too many",
    notes: "Blended end to end to see if I can give one away. The join vanished after a few circles, so one is going to a friend.",
    paper: "smooth-cardstock",
    tools: ["foam"],
    authorEmail: "noor@blendwell.test",
    inks: [
      { brand: "brackenfold", name: "Rowan Berry" },
      { brand: "tidewick", name: "Flare Red" },
    ],
  },
  {
    title: "Seaside sage and sand",
    notes: "Muted beach colours for a masculine card. Sand tones in the middle, olive and mud at the ends.",
    paper: "cold-press",
    tools: ["sponge"],
    authorEmail: "elke@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Kelp Ribbon" },
      { brand: "tidewick", name: "Sandbar Gold" },
      { brand: "tidewick", name: "Driftwood Pale" },
      { brand: "tidewick", name: "Low Tide Mud" },
    ],
  },
  {
    title: "First strip, please be kind",
    notes: "Only had three pads. I started with the light one in the middle like the tutorial said and it helped a lot.",
    paper: "smooth-cardstock",
    tools: ["foam"],
    authorEmail: "jonah@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Blueberry Crumble" },
      { brand: "ostrelle", name: "Duck Egg Icing" },
      { brand: "ostrelle", name: "Spearmint Tin" },
    ],
  },
  {
    title: "Kingfisher flash",
    notes:
      "Deep blue, bright turquoise, then a jump to orange. Left a hair of white between turquoise and orange so they do not go brown.",
    paper: "hot-press",
    tools: ["blending-brush"],
    authorEmail: "priya@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Lapis Cavern" },
      { brand: "tidewick", name: "Lagoon Shallows" },
      { brand: "brackenfold", name: "Kindling Orange" },
    ],
  },
  {
    title: "Wild raspberry patch",
    notes: "Berry red and leaf green with a milky pink between. Red and green never touch.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "ruth@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Rhodolite" },
      { brand: "ostrelle", name: "Strawberry Milk" },
      { brand: "ostrelle", name: "Sorrel Leaf" },
    ],
  },
  {
    title: "Desert road trip",
    notes: "Five inks: rock browns through amber into a pale salt band, then a little sky at the end. Took about twenty minutes.",
    paper: "mixed-media",
    tools: ["blending-brush", "foam"],
    authorEmail: "femi@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Desert Varnish" },
      { brand: "kelpforth", name: "Rust Gully" },
      { brand: "kelpforth", name: "Amber Quarry" },
      { brand: "kelpforth", name: "Salt Flat" },
      { brand: "tidewick", name: "Spindrift Blue" },
    ],
  },
  {
    title: "Misty morning on the fells",
    notes: "Greys and a grey-green. The sea fret pale is the mist; keep it wide.",
    paper: "cold-press",
    tools: ["blending-brush"],
    authorEmail: "admin@blendwell.test",
    inks: [
      { brand: "brackenfold", name: "Slate Roof" },
      { brand: "brackenfold", name: "Drystone Grey" },
      { brand: "tidewick", name: "Sea Fret" },
      { brand: "brackenfold", name: "Bog Myrtle" },
    ],
  },
  {
    title: "Pink lemonade for a baby card",
    notes: "Pastels only. Pigment pads on smooth card need a light hand or they streak.",
    paper: "smooth-cardstock",
    tools: ["dauber", "foam"],
    authorEmail: "mara@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Thrift Cushion" },
      { brand: "ostrelle", name: "Custard Tart" },
      { brand: "ostrelle", name: "Strawberry Milk" },
      { brand: "ostrelle", name: "Rhubarb Fool" },
    ],
  },
  {
    title: "Aubergine and olive",
    notes: "Purple and yellow-green are opposites, so the oatcake does the peacekeeping. On a vellum-finish bristol offcut; looks great behind gold heat embossing.",
    paper: "other",
    tools: ["blending-brush"],
    authorEmail: "jonah@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Blackcurrant Cordial" },
      { brand: "brackenfold", name: "Oatcake" },
      { brand: "kelpforth", name: "Olivine Sand" },
    ],
  },
  {
    title: "Gull Wing next to Moonlit Tin",
    notes: "Two pale greys from different makers. On white card they match; on kraft the second one looks a touch bluer.",
    paper: "smooth-cardstock",
    tools: ["foam"],
    authorEmail: "elke@blendwell.test",
    inks: [
      { brand: "tidewick", name: "Gull Wing" },
      { brand: "kelpforth", name: "Moonlit Tin" },
    ],
  },
  {
    title: "Ember to ash",
    notes: "Dark red through coral and then grey, like a fire burning down. The coral is the lightest band.",
    paper: "cold-press",
    tools: ["blending-brush", "sponge"],
    authorEmail: "ivo@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Garnet Vein" },
      { brand: "brackenfold", name: "Rowan Berry" },
      { brand: "tidewick", name: "Sunset Pier" },
      { brand: "kelpforth", name: "Ash Plain" },
    ],
  },
  {
    title: "Citrus grove",
    notes: "Leaf green, lemon, blood orange. Blended on a scrap of glossy card, which keeps the colours bright but shows every swirl.",
    paper: "other",
    tools: ["blending-brush"],
    authorEmail: "noor@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Sorrel Leaf" },
      { brand: "ostrelle", name: "Lemon Curd" },
      { brand: "ostrelle", name: "Blood Orange Peel" },
    ],
  },
  {
    title: "Northern lights over the fjord",
    notes: "Night sky at both ends with the green glow and an icy band between. Spritzed with water while still damp.",
    paper: "smooth-cardstock",
    tools: ["blending-brush", "other"],
    authorEmail: "femi@blendwell.test",
    inks: [
      { brand: "kelpforth", name: "Polar Night" },
      { brand: "kelpforth", name: "Aurora Veil" },
      { brand: "kelpforth", name: "Glacier Melt" },
      { brand: "kelpforth", name: "Northern Dusk" },
    ],
  },
  {
    title: "Harvest loaf",
    notes: "Warm bread colours for a thank-you card. Honey and oat in the middle, crust browns at each end.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    authorEmail: "ruth@blendwell.test",
    inks: [
      { brand: "ostrelle", name: "Gingerbread" },
      { brand: "brackenfold", name: "Clover Honey" },
      { brand: "brackenfold", name: "Oatcake" },
      { brand: "brackenfold", name: "Chestnut Husk" },
    ],
  },
];
