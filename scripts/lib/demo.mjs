// The demo sign-ins that `npm run seed` (server CLI `seed`) creates; printed by `npm start`.
export const DEMO_PASSWORD = "ember-demo-2026";
export const DEMO_WORKSPACE = { slug: "halvard-thermal", name: "Halvard Thermoworks — Ember line" };
export const DEMO_USERS = [
  { role: "admin", name: "Mira Okafor", email: "mira@halvard.example" },
  { role: "lead", name: "Tomas Lind", email: "tomas@halvard.example" },
  { role: "engineer", name: "Priya Raman", email: "priya@halvard.example" },
  { role: "viewer", name: "Jon Eide", email: "jon@halvard.example" },
];
