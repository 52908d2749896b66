// The invented town of Wrenfold and its venue, Larkspur Hall Gardens. Streets are polylines in
// metres east (x) and north (y) of the town centre; they feed both the demo data and the basemap.
export interface StreetDef {
  code: string
  name: string
  kind: 'street' | 'square' | 'park'
  client: 'town' | 'venue'
  importance: number
  path: [number, number][]
  widthM: number
  access?: { from: string; to: string; note: string }
}

export const streets: StreetDef[] = [
  {
    code: 'HS',
    name: 'High Street',
    kind: 'street',
    client: 'town',
    importance: 5,
    widthM: 14,
    path: [
      [-600, 0],
      [-40, 0],
      [40, 0],
      [600, 0],
    ],
    access: { from: '06:00', to: '10:00', note: 'Pedestrian zone: vehicles only before 10:00' },
  },
  {
    code: 'MS',
    name: 'Market Square',
    kind: 'square',
    client: 'town',
    importance: 5,
    widthM: 80,
    path: [
      [-40, -40],
      [40, -40],
      [40, 40],
      [-40, 40],
      [-40, -40],
    ],
    access: { from: '06:00', to: '10:00', note: 'Market stalls from 10:00' },
  },
  {
    code: 'BR',
    name: 'Bridge Street',
    kind: 'street',
    client: 'town',
    importance: 4,
    widthM: 12,
    path: [
      [600, 0],
      [900, -150],
      [1150, -200],
    ],
  },
  {
    code: 'SR',
    name: 'Station Road',
    kind: 'street',
    client: 'town',
    importance: 3,
    widthM: 12,
    path: [
      [0, -40],
      [0, -700],
    ],
  },
  {
    code: 'CL',
    name: 'Chapel Lane',
    kind: 'street',
    client: 'town',
    importance: 2,
    widthM: 8,
    path: [
      [-300, 0],
      [-300, 350],
      [-250, 600],
    ],
  },
  {
    code: 'TR',
    name: 'Tanners Row',
    kind: 'street',
    client: 'town',
    importance: 2,
    widthM: 8,
    path: [
      [-600, 200],
      [-300, 200],
    ],
  },
  {
    code: 'RW',
    name: 'Ropewalk',
    kind: 'street',
    client: 'town',
    importance: 3,
    widthM: 10,
    path: [
      [200, 0],
      [250, 400],
    ],
  },
  {
    code: 'ML',
    name: 'Mill Lane',
    kind: 'street',
    client: 'town',
    importance: 2,
    widthM: 8,
    path: [
      [250, 400],
      [600, 450],
    ],
  },
  {
    code: 'CH',
    name: 'Castle Hill',
    kind: 'street',
    client: 'town',
    importance: 3,
    widthM: 10,
    path: [
      [-600, 0],
      [-850, 120],
      [-1000, 300],
    ],
  },
  {
    code: 'QP',
    name: 'Quay Parade',
    kind: 'street',
    client: 'town',
    importance: 4,
    widthM: 12,
    path: [
      [600, -250],
      [1100, -350],
    ],
  },
  {
    code: 'AG',
    name: 'Abbey Green',
    kind: 'square',
    client: 'town',
    importance: 4,
    widthM: 60,
    path: [
      [-330, 420],
      [-230, 420],
      [-230, 500],
      [-330, 500],
      [-330, 420],
    ],
  },
  {
    code: 'FS',
    name: 'Foundry Street',
    kind: 'street',
    client: 'town',
    importance: 2,
    widthM: 10,
    path: [
      [0, -350],
      [450, -350],
    ],
  },
  {
    code: 'GD',
    name: 'Larkspur Hall Gardens',
    kind: 'park',
    client: 'venue',
    importance: 4,
    widthM: 5,
    path: [
      [760, 380],
      [900, 520],
      [1040, 380],
      [900, 260],
      [760, 380],
    ],
    access: { from: '08:00', to: '15:30', note: 'Gates open to crews 08:00–15:30' },
  },
]

/** The river and the riverside path drawn on the basemap only. */
export const river: [number, number][] = [
  [-1300, -300],
  [-400, -330],
  [400, -300],
  [800, -310],
  [1400, -430],
]

export const clientsDef = {
  town: {
    name: 'Wrenfold Town Council',
    kind: 'council' as const,
    contactName: 'Hester Vane (Events Officer)',
    contactEmail: 'events@wrenfold.example',
    contractRef: 'WTC-FL-2026-03',
    emergency: 24,
    standard: 36,
    switchOn: '16:00',
    switchOff: '23:00',
    tariff: 0.29,
  },
  venue: {
    name: 'Larkspur Hall Gardens',
    kind: 'venue' as const,
    contactName: 'Orla Benthamley (Estates)',
    contactEmail: 'estates@larkspurhall.example',
    contractRef: 'LHG-WL-26',
    emergency: 12,
    standard: 24,
    switchOn: '16:30',
    switchOff: '22:00',
    tariff: 0.31,
  },
}
