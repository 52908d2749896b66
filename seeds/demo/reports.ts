import type { Db } from '../../server/db'

const H = 3_600_000

// Public fault reports as a passer-by would write them (invented).
export async function seedReports(db: Db, now: Date) {
  const t = now.getTime()
  const byTag = async (tag: string) =>
    (await db('strings').where({ assetTag: tag }).first('id', 'lat', 'lng')) ?? null
  const defs = [
    {
      ref: 'LW-7K3QD',
      tag: 'WF-HS-012',
      street: 'High Street',
      landmark: 'outside the bakery',
      description: 'Half the lights across the street have gone out since last night.',
      hazard: false,
      state: 'received',
      at: t - 5 * H,
    },
    {
      ref: 'LW-M4TZP',
      tag: null,
      street: 'Quay Parade',
      landmark: 'by the ferry steps',
      description: 'A wire is hanging low over the pavement, about head height.',
      hazard: true,
      state: 'received',
      at: t - 2 * H,
    },
    {
      ref: 'LW-R8VXA',
      tag: 'WF-AG-009',
      street: 'Abbey Green',
      landmark: 'big tree near the bench',
      description: 'Tree lights flicker on and off.',
      hazard: false,
      state: 'in_hand',
      at: t - 30 * H,
    },
    {
      ref: 'LW-C2NWE',
      tag: 'WF-BR-004',
      street: 'Bridge Street',
      landmark: '',
      description: 'Lights not working on the bridge end.',
      hazard: false,
      state: 'fixed',
      at: t - 80 * H,
    },
  ]
  for (const d of defs) {
    const s = d.tag ? await byTag(d.tag) : null
    await db('reports').insert({
      ref: d.ref,
      stringId: s?.id ?? null,
      tagText: d.tag,
      streetText: d.street,
      landmark: d.landmark || null,
      description: d.description,
      hazard: d.hazard,
      lat: s?.lat ?? null,
      lng: s?.lng ?? null,
      reporterName: null,
      reporterEmail: null,
      state: d.state,
      createdAt: new Date(d.at),
      updatedAt: new Date(d.at),
    })
  }
  return defs.length
}
