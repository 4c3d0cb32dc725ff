import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { GasMixture } from '../../server/models/index'
import { signedInAgent } from '../support/http-agent'
import { createTestApp, type TestApp } from '../support/test-app'

let t: TestApp
beforeAll(async () => {
  t = await createTestApp()
})
afterAll(async () => {
  await t.close()
})

const doubled = {
  name: 'Doubled CO₂ study',
  description: 'Twice the pre-industrial CO₂',
  gases: { CO2: { mode: 'uniform', vmr: 556e-6 }, CH4: { mode: 'uniform', vmr: 729e-9 }, H2O: { mode: 'scale', factor: 1 } },
}

describe('gas mixtures API', () => {
  it('when signed out, answers 401', async () => {
    await request(t.app).get('/api/mixtures').expect(401)
  })

  it('lists the presets of our own scenarios', async () => {
    const a = await signedInAgent(t, 'reviewer')
    const res = await a.get('/api/mixtures/presets').expect(200)
    expect(res.body.presets.map((p: { id: string }) => p.id)).toEqual(
      expect.arrayContaining(['pre-industrial', 'present-day', 'doubled-co2']),
    )
  })

  it('when an analyst creates a mixture, it is listed, searchable and readable by a reviewer', async () => {
    const analyst = await signedInAgent(t, 'analyst')
    const created = await analyst.post('/api/mixtures', doubled).expect(201)
    expect(created.body.mixture).toMatchObject({ name: 'Doubled CO₂ study', gases: doubled.gases })
    const reviewer = await signedInAgent(t, 'reviewer')
    const page = await reviewer.get('/api/mixtures?search=doubled&page=1&pageSize=5').expect(200)
    expect(page.body).toMatchObject({ total: 1, page: 1, pageSize: 5 })
    expect(page.body.items[0].ownerName).toBe('Ines Varga')
    await reviewer.get(`/api/mixtures/${created.body.mixture.id}`).expect(200)
  })

  it('when a reviewer tries to create one, answers 403 and stores nothing', async () => {
    const before = await GasMixture.count()
    const reviewer = await signedInAgent(t, 'reviewer')
    await reviewer.post('/api/mixtures', doubled).expect(403)
    expect(await GasMixture.count()).toBe(before)
  })

  it.each([
    ['a negative amount', { CO2: { mode: 'uniform', vmr: -1e-6 } }, 'gases.CO2.vmr'],
    ['an unknown gas', { XE: { mode: 'uniform', vmr: 1e-6 } }, 'gases'],
    ['an unknown mode', { CO2: { mode: 'double', vmr: 1e-6 } }, 'gases.CO2.mode'],
    ['trace gases above 5 % of the air', { CO2: { mode: 'uniform', vmr: 0.03 }, CH4: { mode: 'uniform', vmr: 0.03 } }, 'gases'],
  ])('when the mixture has %s, answers 400 naming the field and stores nothing', async (_label, gases, field) => {
    const before = await GasMixture.count()
    const analyst = await signedInAgent(t, 'analyst')
    const res = await analyst.post('/api/mixtures', { name: 'Bad', gases }).expect(400)
    expect(res.body.error.details.fields.map((f: { field: string }) => f.field)).toContain(field)
    expect(await GasMixture.count()).toBe(before)
  })

  it('when someone else edits a mixture, answers 403; the owner and an admin may', async () => {
    const analyst = await signedInAgent(t, 'analyst')
    const id = (await analyst.post('/api/mixtures', doubled).expect(201)).body.mixture.id
    const admin = await signedInAgent(t, 'admin')
    const adminCopy = (await admin.post(`/api/mixtures/${id}/duplicate`).expect(201)).body.mixture
    expect(adminCopy.name).toBe('Doubled CO₂ study (copy)')
    await analyst.put(`/api/mixtures/${adminCopy.id}`, { ...doubled, name: 'Mine now?' }).expect(403)
    await analyst.put(`/api/mixtures/${id}`, { ...doubled, name: 'Renamed' }).expect(200)
    await admin.delete(`/api/mixtures/${id}`).expect(204)
    await analyst.get(`/api/mixtures/${id}`).expect(404)
  })
})
