/** The demo sign-ins, printed by the start command. Invented people of an invented business. */
export const DEMO_ACCOUNTS = [
  { role: 'owner', name: 'Wren Calloway', email: 'owner@hollowmere.test', password: 'demo-owner-pass' },
  { role: 'keeper', name: 'Tobias Venn', email: 'keeper@hollowmere.test', password: 'demo-keeper-pass' },
  { role: 'keeper', name: 'Ines Marlowe', email: 'keeper2@hollowmere.test', password: 'demo-keeper-pass' },
  { role: 'crew', name: 'Jory Ashdown', email: 'crew@hollowmere.test', password: 'demo-crew-pass' },
  { role: 'customer', name: 'Pella Quist', email: 'customer@hollowmere.test', password: 'demo-customer-pass' },
  { role: 'customer', name: 'Corin Bask', email: 'corin@hollowmere.test', password: 'demo-customer-pass' },
  { role: 'customer', name: 'Lio Fenwick', email: 'lio@hollowmere.test', password: 'demo-customer-pass' },
] as const;
