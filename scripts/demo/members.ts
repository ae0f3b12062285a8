// Invented demo accounts. Every name here is made up; the e-mail domain is the reserved
// ".test" top-level domain (RFC 2606), so no demo mail can reach a real mailbox.

export type DemoRole = "member" | "moderator" | "admin";
export type DemoStanding = "new" | "trusted";

export interface DemoMember {
  email: string;
  name: string;
  role: DemoRole;
  standing: DemoStanding;
  bio: string;
}

/** Every demo account signs in with this password (demo and test data only). */
export const DEMO_PASSWORD = "blendwell-demo";

export const demoMembers: DemoMember[] = [
  {
    email: "mara@blendwell.test",
    name: "Mara Fenholt",
    role: "member",
    standing: "trusted",
    bio: "Card maker for twelve years. I keep every test strip in a shoebox and finally have somewhere better to put them. Mostly dye inks, mostly sunsets.",
  },
  {
    email: "noor@blendwell.test",
    name: "Noor Vessant",
    role: "member",
    standing: "new",
    bio: "Just bought my first four ink pads and a set of blending brushes. Here to learn which colours play nicely together.",
  },
  {
    email: "ivo@blendwell.test",
    name: "Ivo Kellerhof",
    role: "moderator",
    standing: "trusted",
    bio: "Scrapbooker and part-time moderator. Ask me about blending on cold-press paper or about the review queue.",
  },
  {
    email: "admin@blendwell.test",
    name: "Tamsin Orrel",
    role: "admin",
    standing: "trusted",
    bio: "Looks after the site settings and the ink catalogue. Blends greys for fun.",
  },
  {
    email: "priya@blendwell.test",
    name: "Priya Wendermoor",
    role: "member",
    standing: "trusted",
    bio: "Mixed-media journals, heavy on pigment inks and stencils. I teach a Thursday evening class at the library.",
  },
  {
    email: "jonah@blendwell.test",
    name: "Jonah Pellicott",
    role: "member",
    standing: "new",
    bio: "Started making cards for my nan's birthday and never stopped. Still working out foam versus brushes.",
  },
  {
    email: "elke@blendwell.test",
    name: "Elke Varnholm",
    role: "member",
    standing: "trusted",
    bio: "Ink-blended backgrounds for slimline cards. I swatch every new pad before it goes in the drawer.",
  },
  {
    email: "ruth@blendwell.test",
    name: "Ruth Abendale",
    role: "member",
    standing: "new",
    bio: "Retired art teacher trying to cut down a stash of ninety pads without losing a colour I need.",
  },
  {
    email: "femi@blendwell.test",
    name: "Femi Lanthorne",
    role: "member",
    standing: "trusted",
    bio: "Night skies and galaxy blends on every card. Always hunting for the perfect deep navy.",
  },
];
