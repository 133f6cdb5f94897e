/**
 * The demo firm's customers and their sites: invented people at invented addresses.
 * `key` names a customer for the demo quotes.
 */
export interface DemoCustomer {
  key: string;
  name: string;
  email: string | null;
  phone: string | null;
  notes: string;
  sites: { label: string; addressLines: string; postcode: string; accessNotes: string }[];
}

export const DEMO_CUSTOMERS: readonly DemoCustomer[] = [
  {
    key: 'ashdown',
    name: 'Eleanor Ashdown-Price',
    email: 'eleanor.ashdown@hollyfield.example',
    phone: '07700 900412',
    notes: 'Prefers warm white. Wants the pond lit before the summer party.',
    sites: [
      {
        label: 'Home',
        addressLines: 'The Old Forge\n14 Hollyfield Lane\nFernhollow',
        postcode: 'FH2 4RD',
        accessNotes: 'Side gate code 2190. Dog in the garden until 10 am.',
      },
    ],
  },
  {
    key: 'okafor',
    name: 'Daniel and Ruth Okafor',
    email: 'okafor.home@brackenmoor.example',
    phone: '07700 900587',
    notes: 'Terrace rebuilt last year; cable ducts left under the new paving.',
    sites: [
      {
        label: 'Home',
        addressLines: '3 Brackenmoor Rise\nLower Tansley',
        postcode: 'LT7 2JE',
        accessNotes: 'Park on the drive.',
      },
    ],
  },
  {
    key: 'whitlow',
    name: 'Whitlow Barn Holidays',
    email: 'bookings@whitlowbarn.example',
    phone: '01632 960118',
    notes: 'Holiday lets: work only on changeover days (Fridays).',
    sites: [
      {
        label: 'Courtyard',
        addressLines: 'Whitlow Barn\nCoppice Road\nAshby Fold',
        postcode: 'AF3 9QP',
        accessNotes: 'Keys from the farmhouse.',
      },
      {
        label: 'Car park and track',
        addressLines: 'Whitlow Barn, lower field entrance\nCoppice Road\nAshby Fold',
        postcode: 'AF3 9QP',
        accessNotes: '',
      },
    ],
  },
  {
    key: 'lindqvist',
    name: 'Sofia Lindqvist',
    email: 'sofia.lindqvist@meadowsweet.example',
    phone: null,
    notes: 'Contact by e-mail only.',
    sites: [
      {
        label: 'Home',
        addressLines: 'Flat 2, Meadowsweet House\n41 Riverside Walk\nFernhollow',
        postcode: 'FH1 8WN',
        accessNotes: 'Roof terrace via the communal stairs.',
      },
    ],
  },
  {
    key: 'parrish',
    name: 'Graham Parrish',
    email: 'g.parrish@stonecroft.example',
    phone: '07700 900233',
    notes: '',
    sites: [
      {
        label: 'Home',
        addressLines: 'Stonecroft\nChurch End\nLittle Wendle',
        postcode: 'LW4 6HT',
        accessNotes: 'Long gravel drive; narrow gateway (2.1 m).',
      },
    ],
  },
  {
    key: 'achterberg',
    name: 'Maaike Achterberg',
    email: 'maaike@orchardgate.example',
    phone: '07700 900975',
    notes: 'Referred by Eleanor Ashdown-Price.',
    sites: [{ label: 'Home', addressLines: 'Orchard Gate\n7 Pippin Close\nLower Tansley', postcode: 'LT7 5AB', accessNotes: '' }],
  },
];
