// Invented demo catalogue: four made-up ink makers and their inks. No real brand or product
// names. Hex values are what each ink might look like dried and blended out on smooth white
// cardstock (dye inks a little dull, never a pure sRGB primary); they were chosen by eye,
// not measured. A few cross-brand pairs are look-alikes on purpose (ΔE2000 under about 3,
// worked out from the hex values) so that the look-alikes feature has something to show:
//   Lighthouse Lamp ~ Citrine Ledge, Rowan Berry ~ Flare Red, Lichen Stone ~ Tundra Lichen,
//   Gull Wing ~ Moonlit Tin, Breaker Foam ~ Duck Egg Icing,
//   Caramel Drizzle ~ Ochre Cliff ~ Cider Press (the last one discontinued: a "what replaces
//   it" case). Some reds and near-blacks also land within 3 of each other, as real ones do.

export type DemoInkType = "dye" | "pigment" | "hybrid";

export interface DemoBrand {
  slug: string;
  name: string;
  country?: string;
  blurb: string;
}

export interface DemoInk {
  /** slug of a brand in demoBrands */
  brand: string;
  name: string;
  type: DemoInkType;
  /** "#rrggbb", lower case */
  hex: string;
  discontinued?: boolean;
}

export const demoBrands: DemoBrand[] = [
  {
    slug: "brackenfold",
    name: "Brackenfold Inkhouse",
    country: "United Kingdom",
    blurb:
      "Soft, weathered dye inks mixed in a converted sheep barn. Muted hedgerow and moorland tones that blend out with no hard lines.",
  },
  {
    slug: "tidewick",
    name: "Tidewick Colourworks",
    country: "Netherlands",
    blurb:
      "Coast and weather colours: sea mist greys, harbour blues and a few bright buoy shades. Mostly juicy dye pads that react well to water.",
  },
  {
    slug: "ostrelle",
    name: "Ostrelle",
    country: "Canada",
    blurb:
      "Chalky pigment and hybrid pads named after the bakery counter. Strong pastels that sit on top of cardstock and layer over darker blends.",
  },
  {
    slug: "kelpforth",
    name: "Kelpforth Dyeworks",
    country: "New Zealand",
    blurb:
      "Deep mineral and night-sky shades, plus a handful of clear brights. Small batches, so colours come and go.",
  },
];

export const demoInks: DemoInk[] = [
  // Brackenfold Inkhouse — muted, distressed-looking dye inks
  { brand: "brackenfold", name: "Hayloft Straw", type: "dye", hex: "#e3c66a" },
  { brand: "brackenfold", name: "Gorse Bloom", type: "dye", hex: "#efc53a" },
  { brand: "brackenfold", name: "Clover Honey", type: "dye", hex: "#d6a54a" },
  { brand: "brackenfold", name: "Mustard Crock", type: "dye", hex: "#b98f2e" },
  { brand: "brackenfold", name: "Cider Press", type: "dye", hex: "#c98a3a", discontinued: true },
  { brand: "brackenfold", name: "Kindling Orange", type: "dye", hex: "#d9782f" },
  { brand: "brackenfold", name: "Bracken Rust", type: "dye", hex: "#a3582b" },
  { brand: "brackenfold", name: "Rowan Berry", type: "dye", hex: "#c2352f" },
  { brand: "brackenfold", name: "Rosehip Jelly", type: "dye", hex: "#b8474a" },
  { brand: "brackenfold", name: "Brick Kiln", type: "dye", hex: "#91413a" },
  { brand: "brackenfold", name: "Hawthorn Blossom", type: "dye", hex: "#efc5c8" },
  { brand: "brackenfold", name: "Foxglove Bell", type: "dye", hex: "#b56d9e" },
  { brand: "brackenfold", name: "Heather Moor", type: "dye", hex: "#8c6b93" },
  { brand: "brackenfold", name: "Sloe Bramble", type: "dye", hex: "#5b3b5e" },
  { brand: "brackenfold", name: "Bluebell Wood", type: "dye", hex: "#6a74b0" },
  { brand: "brackenfold", name: "Rain Barrel", type: "dye", hex: "#7e9fb0" },
  { brand: "brackenfold", name: "Slate Roof", type: "dye", hex: "#5b6b7a" },
  { brand: "brackenfold", name: "Tarn Water", type: "hybrid", hex: "#3e5f74" },
  { brand: "brackenfold", name: "Millpond", type: "dye", hex: "#5e8a8a" },
  { brand: "brackenfold", name: "Lichen Stone", type: "dye", hex: "#a7ac7e" },
  { brand: "brackenfold", name: "Mossbank", type: "dye", hex: "#7d8b4a" },
  { brand: "brackenfold", name: "Hedgerow Green", type: "dye", hex: "#5f7d45" },
  { brand: "brackenfold", name: "Bog Myrtle", type: "hybrid", hex: "#6f7f5f" },
  { brand: "brackenfold", name: "Fern Shadow", type: "dye", hex: "#3f5e44" },
  { brand: "brackenfold", name: "Oatcake", type: "dye", hex: "#dccaa5" },
  { brand: "brackenfold", name: "Chestnut Husk", type: "dye", hex: "#7a4f33" },
  { brand: "brackenfold", name: "Ploughed Field", type: "dye", hex: "#6b5443" },
  { brand: "brackenfold", name: "Dovecote", type: "dye", hex: "#b9b4ae" },
  { brand: "brackenfold", name: "Drystone Grey", type: "dye", hex: "#9a9890" },
  { brand: "brackenfold", name: "Peat Smoke", type: "dye", hex: "#5d5550" },
  { brand: "brackenfold", name: "Oak Gall", type: "dye", hex: "#3b3330" },
  { brand: "brackenfold", name: "Chimney Soot", type: "pigment", hex: "#2e2c2d" },

  // Tidewick Colourworks — coast and weather, dye and hybrid
  { brand: "tidewick", name: "Lighthouse Lamp", type: "dye", hex: "#f4d548" },
  { brand: "tidewick", name: "Sandbar Gold", type: "dye", hex: "#d9b558" },
  { brand: "tidewick", name: "Mooring Rope", type: "dye", hex: "#b08a55", discontinued: true },
  { brand: "tidewick", name: "Buoy Orange", type: "dye", hex: "#e46b2c" },
  { brand: "tidewick", name: "Sunset Pier", type: "dye", hex: "#ee8a6a" },
  { brand: "tidewick", name: "Shrimp Net", type: "dye", hex: "#f19e94" },
  { brand: "tidewick", name: "Flare Red", type: "dye", hex: "#c5372f" },
  { brand: "tidewick", name: "Thrift Cushion", type: "dye", hex: "#e58fae" },
  { brand: "tidewick", name: "Anemone Bloom", type: "dye", hex: "#c9457a" },
  { brand: "tidewick", name: "Urchin Spine", type: "hybrid", hex: "#5b2e5f" },
  { brand: "tidewick", name: "Dusk Over Water", type: "dye", hex: "#8a7fb0" },
  { brand: "tidewick", name: "Trawler Navy", type: "hybrid", hex: "#2a3a66" },
  { brand: "tidewick", name: "Deep Sounding", type: "hybrid", hex: "#1f3550" },
  { brand: "tidewick", name: "Mackerel Sky", type: "dye", hex: "#6f8fb8" },
  { brand: "tidewick", name: "Spindrift Blue", type: "dye", hex: "#8fbfdc" },
  { brand: "tidewick", name: "Sea Fret", type: "dye", hex: "#c5d3d6" },
  { brand: "tidewick", name: "Riptide", type: "hybrid", hex: "#1f6e8c" },
  { brand: "tidewick", name: "Lagoon Shallows", type: "dye", hex: "#47b1b8" },
  { brand: "tidewick", name: "Tidewater Teal", type: "dye", hex: "#2f8e8e" },
  { brand: "tidewick", name: "Breaker Foam", type: "dye", hex: "#bfe3df" },
  { brand: "tidewick", name: "Rockpool Green", type: "dye", hex: "#6fae9a" },
  { brand: "tidewick", name: "Kelp Ribbon", type: "dye", hex: "#5d6b3a" },
  { brand: "tidewick", name: "Driftwood Pale", type: "dye", hex: "#c4b39a" },
  { brand: "tidewick", name: "Low Tide Mud", type: "dye", hex: "#7a6a55" },
  { brand: "tidewick", name: "Pebble Shore", type: "pigment", hex: "#918a80" },
  { brand: "tidewick", name: "Gull Wing", type: "dye", hex: "#aeb1b4" },
  { brand: "tidewick", name: "Harbour Fog", type: "dye", hex: "#8e9ca3" },
  { brand: "tidewick", name: "Squall Line", type: "dye", hex: "#4d5f70" },
  { brand: "tidewick", name: "Storm Petrel", type: "dye", hex: "#3d3f48" },

  // Ostrelle — bakery-counter pigments and hybrids, pastels and brights
  { brand: "ostrelle", name: "Lemon Curd", type: "pigment", hex: "#f6e07a" },
  { brand: "ostrelle", name: "Custard Tart", type: "pigment", hex: "#f4d89a" },
  { brand: "ostrelle", name: "Saffron Bun", type: "dye", hex: "#f0b23a", discontinued: true },
  { brand: "ostrelle", name: "Apricot Glaze", type: "hybrid", hex: "#f3a96a" },
  { brand: "ostrelle", name: "Blood Orange Peel", type: "dye", hex: "#e0602e" },
  { brand: "ostrelle", name: "Paprika Dust", type: "pigment", hex: "#b8452f" },
  { brand: "ostrelle", name: "Cherry Compote", type: "hybrid", hex: "#b0243a" },
  { brand: "ostrelle", name: "Raspberry Coulis", type: "dye", hex: "#c8325f" },
  { brand: "ostrelle", name: "Rhubarb Fool", type: "pigment", hex: "#e48aa0" },
  { brand: "ostrelle", name: "Strawberry Milk", type: "pigment", hex: "#f5c2cc" },
  { brand: "ostrelle", name: "Sugared Almond", type: "pigment", hex: "#f1d7d0" },
  { brand: "ostrelle", name: "Plum Jam", type: "hybrid", hex: "#6e2d55" },
  { brand: "ostrelle", name: "Blackcurrant Cordial", type: "dye", hex: "#4b2146" },
  { brand: "ostrelle", name: "Violet Cream", type: "pigment", hex: "#b8a0d4" },
  { brand: "ostrelle", name: "Lavender Shortbread", type: "pigment", hex: "#cbbbe0" },
  { brand: "ostrelle", name: "Blueberry Crumble", type: "hybrid", hex: "#4a56a0" },
  { brand: "ostrelle", name: "Cornflower Tea", type: "dye", hex: "#6d8fd6" },
  { brand: "ostrelle", name: "Duck Egg Icing", type: "pigment", hex: "#b8dcd9" },
  { brand: "ostrelle", name: "Mint Fondant", type: "pigment", hex: "#a9e0c2" },
  { brand: "ostrelle", name: "Spearmint Tin", type: "dye", hex: "#3fa58a" },
  { brand: "ostrelle", name: "Pistachio Gelato", type: "hybrid", hex: "#a8c77f" },
  { brand: "ostrelle", name: "Greengage", type: "dye", hex: "#9bbd4a" },
  { brand: "ostrelle", name: "Matcha Whisk", type: "pigment", hex: "#7f9a45" },
  { brand: "ostrelle", name: "Sorrel Leaf", type: "dye", hex: "#4f8a3c" },
  { brand: "ostrelle", name: "Caramel Drizzle", type: "dye", hex: "#c0853f" },
  { brand: "ostrelle", name: "Gingerbread", type: "hybrid", hex: "#9a5f34" },
  { brand: "ostrelle", name: "Burnt Sugar", type: "hybrid", hex: "#6a3f22" },
  { brand: "ostrelle", name: "Cocoa Nib", type: "pigment", hex: "#4e362b" },
  { brand: "ostrelle", name: "Oyster Mushroom", type: "pigment", hex: "#c3bcb0" },
  { brand: "ostrelle", name: "Liquorice Twist", type: "pigment", hex: "#262324" },

  // Kelpforth Dyeworks — minerals, places and night skies; deep shades and a few brights
  { brand: "kelpforth", name: "Citrine Ledge", type: "dye", hex: "#f2d24a" },
  { brand: "kelpforth", name: "Amber Quarry", type: "dye", hex: "#d68f2a" },
  { brand: "kelpforth", name: "Ochre Cliff", type: "dye", hex: "#c2873e" },
  { brand: "kelpforth", name: "Magma Glow", type: "dye", hex: "#e2562e" },
  { brand: "kelpforth", name: "Cinnabar Seam", type: "hybrid", hex: "#b63a2a" },
  { brand: "kelpforth", name: "Rust Gully", type: "dye", hex: "#9a4a2a" },
  { brand: "kelpforth", name: "Garnet Vein", type: "hybrid", hex: "#7e2430" },
  { brand: "kelpforth", name: "Rhodolite", type: "dye", hex: "#a33a5c" },
  { brand: "kelpforth", name: "Tourmaline Pink", type: "pigment", hex: "#e07aa6" },
  { brand: "kelpforth", name: "Amethyst Geode", type: "dye", hex: "#6c4a9a" },
  { brand: "kelpforth", name: "Northern Dusk", type: "dye", hex: "#7b6aa8" },
  { brand: "kelpforth", name: "Meteor Trail", type: "dye", hex: "#c7d0e8", discontinued: true },
  { brand: "kelpforth", name: "Cobalt Lantern", type: "dye", hex: "#3358b8" },
  { brand: "kelpforth", name: "Lapis Cavern", type: "hybrid", hex: "#26408a" },
  { brand: "kelpforth", name: "Fjord Blue", type: "dye", hex: "#2f5f9a" },
  { brand: "kelpforth", name: "Polar Night", type: "hybrid", hex: "#1d2340" },
  { brand: "kelpforth", name: "Glacier Melt", type: "dye", hex: "#9fd3e0" },
  { brand: "kelpforth", name: "Aurora Veil", type: "dye", hex: "#3fb59a" },
  { brand: "kelpforth", name: "Jade Terrace", type: "dye", hex: "#3a9a74" },
  { brand: "kelpforth", name: "Malachite Deep", type: "hybrid", hex: "#1f5e4a" },
  { brand: "kelpforth", name: "Serpentine", type: "dye", hex: "#4f7a55" },
  { brand: "kelpforth", name: "Olivine Sand", type: "dye", hex: "#9aa04a" },
  { brand: "kelpforth", name: "Tundra Lichen", type: "dye", hex: "#a4ab80" },
  { brand: "kelpforth", name: "Salt Flat", type: "pigment", hex: "#e6e0d2" },
  { brand: "kelpforth", name: "Desert Varnish", type: "dye", hex: "#6a4530" },
  { brand: "kelpforth", name: "Moonlit Tin", type: "dye", hex: "#b0b4b9" },
  { brand: "kelpforth", name: "Ash Plain", type: "dye", hex: "#8a8784" },
  { brand: "kelpforth", name: "Basalt Column", type: "pigment", hex: "#3a3a3c" },
  { brand: "kelpforth", name: "Volcanic Glass", type: "hybrid", hex: "#2a2530" },
];
