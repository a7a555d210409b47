/** Every name below is invented: the shop, its people, its customers, the teams and the players. */
export const demoShop = {
  name: 'Tallowmere Frame Works',
  password: 'demo-frames-2026',
  members: [
    { email: 'owner@tallowmere.example', name: 'Ines Varga', role: 'owner' },
    { email: 'designer@tallowmere.example', name: 'Otto Brannigan', role: 'designer' },
    { email: 'desk@tallowmere.example', name: 'Lupe Castellane', role: 'front_desk' },
  ],
} as const;

export const demoCustomers = [
  { name: 'Marguerite Oduya', email: 'marguerite@oduya.example', phone: '555-0141', address: '18 Quillon Row, Port Wendle' },
  { name: 'Teodor Halvorsen-Pike', email: 'teo.hp@example.net', phone: '555-0177', address: '4 Brackwater Lane, Ashby Flats' },
  { name: 'Carrow Valley Ironwhelms Booster Club', email: 'boosters@ironwhelms.example', phone: '555-0102', address: '900 Stadium Way, Carrow Valley' },
  { name: 'Delphine Ashcombe', email: 'delphine@ashcombe.example', phone: '555-0163', address: '22 Millrace Court, Port Wendle' },
  { name: 'Rufus Okonkwo-Bell', email: 'rufus.ob@example.org', phone: '555-0119', address: '3 Tern Street, Saltmarsh Bay' },
  { name: 'Hollis Vantreese', email: 'hollis@vantreese.example', phone: '555-0185', address: '71 Orchard Rise, Brindle Hollow' },
  { name: 'Port Wendle Tidewicks Alumni', email: 'alumni@tidewicks.example', phone: '555-0150', address: 'Tidewick Park, Port Wendle' },
  { name: 'Svea Marchetti', email: 'svea@marchetti.example', phone: '555-0126', address: '9 Lantern Walk, Ashby Flats' },
  { name: 'Amadou Fairweather', email: 'amadou@fairweather.example', phone: '555-0131', address: '150 Kestrel Road, Carrow Valley' },
  { name: 'Beatrix Coldwell', email: 'bea@coldwell.example', phone: '555-0194', address: '6 Foundry Yard, Saltmarsh Bay' },
  { name: 'Ignatius Rowe', email: 'iggy@rowe.example', phone: '555-0108', address: '41 Heron Bank, Brindle Hollow' },
  { name: 'Celestine Moorcroft', email: 'celestine@moorcroft.example', phone: '555-0172', address: '12 Chandlers Way, Port Wendle' },
];

type Status =
  | 'taken_in' | 'designing' | 'awaiting_approval' | 'approved' | 'cutting'
  | 'assembling' | 'ready' | 'shipped' | 'collected' | 'cancelled';

export const demoJobs: { title: string; customer: number; status: Status; dueDays: number | null; notes?: string }[] = [
  { title: 'Port Wendle Tidewicks home jersey #14 with two patches and a plaque', customer: 0, status: 'designing', dueDays: 12, notes: 'Signed across the number; keep the signature clear of the window edge.' },
  { title: 'Ironwhelms championship jersey #7, team photo and ticket stubs', customer: 2, status: 'taken_in', dueDays: 21 },
  { title: 'Ashby Flats Skylarrows signed away jersey #22', customer: 1, status: 'awaiting_approval', dueDays: 6 },
  { title: 'Saltmarsh Bay Brinewrights jersey #3 and season medal', customer: 4, status: 'approved', dueDays: 9 },
  { title: 'Brindle Hollow Thistlejacks retirement jersey #88', customer: 5, status: 'cutting', dueDays: 4 },
  { title: 'Tidewicks 1990s throwback jersey #10 for the clubhouse', customer: 6, status: 'assembling', dueDays: 3 },
  { title: 'Skylarrows youth jersey #5 with first-game photo', customer: 7, status: 'ready', dueDays: -1 },
  { title: 'Carrow Valley Ironwhelms captain jersey #1, shipped across the country', customer: 8, status: 'shipped', dueDays: -6, notes: 'Acrylic glazing for shipping.' },
  { title: 'Brinewrights pennant and two ticket stubs', customer: 9, status: 'collected', dueDays: -12 },
  { title: 'Thistlejacks practice jersey #31 (customer changed plans)', customer: 10, status: 'cancelled', dueDays: null },
  { title: 'Tidewicks rookie card and signed puck shadowbox', customer: 11, status: 'designing', dueDays: 15 },
  { title: 'Ashcombe family jerseys #12 and #21 side by side', customer: 3, status: 'taken_in', dueDays: null },
];

export const demoPieces = {
  jersey: { kind: 'garment', label: 'Home jersey #14, folded', widthIn: 16, heightIn: 19, notes: 'Sleeves folded at the shoulder.' },
  patchA: { kind: 'patch', label: 'League crest patch', widthIn: 4, heightIn: 4 },
  patchB: { kind: 'patch', label: 'Anniversary patch', widthIn: 4, heightIn: 4 },
  photo: { kind: 'photo', label: 'Game-winning goal print', widthIn: 10, heightIn: 8 },
  plaque: { kind: 'plaque', label: 'Engraved plaque', widthIn: 9, heightIn: 3 },
} as const;
