// Invented makers for the demo scenario. None of them is a real company or brand; websites use the
// reserved .example domain (RFC 2606) or are left unknown.
export type DemoManufacturer = { slug: string; name: string; website: string | null };

export const DEMO_MANUFACTURERS: readonly DemoManufacturer[] = [
  { slug: "brackenwell", name: "Brackenwell Avionics", website: "https://brackenwell.example" },
  { slug: "fernhollow", name: "Fernhollow Circuits", website: "https://fernhollow.example" },
  { slug: "kestrune", name: "Kestrune Labs", website: "https://kestrune.example" },
  { slug: "marlpit", name: "Marlpit Electric", website: null },
  { slug: "tarnwick", name: "Tarnwick Avionics", website: "https://tarnwick.example" },
  { slug: "duskwren", name: "Duskwren Devices", website: "https://duskwren.example" },
  { slug: "copperlode", name: "Copperlode Power", website: "https://copperlode.example" },
  { slug: "ivelmoor", name: "Ivelmoor Hobby Works", website: null },
];
