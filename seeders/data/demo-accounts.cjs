// The demo organisation's people, one per role. Passwords are for local demos only.
module.exports = {
  ORGANIZATION: 'Kestrel Vale Infrastructure',
  PASSWORD: 'demo-outturn-2026',
  PEOPLE: [
    { email: 'owner@kestrelvale.example', name: 'Ines Okafor', role: 'owner' },
    { email: 'estimator@kestrelvale.example', name: 'Tomas Lindqvist', role: 'estimator' },
    { email: 'sponsor@kestrelvale.example', name: 'Priya Raman', role: 'sponsor' },
    { email: 'billing@kestrelvale.example', name: 'Hugo Marchetti', role: 'billing' },
  ],
};
