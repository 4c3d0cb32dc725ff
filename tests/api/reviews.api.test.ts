import { createHash } from 'node:crypto'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Review, Run, RunResult } from '../../server/models/index'
import { canonicalJson } from '../../server/runs/canonical-json'
import type { RunDetail, RunSummary } from '../../shared/schemas/runs'
import type { ReviewQueueItem, RunReview } from '../../shared/schemas/reviews'
import { signedInAgent } from '../support/http-agent'
import { createPresetProfile, QUICK_RUN_SETTINGS, waitForRun } from '../support/runs'
import { createTestApp, type TestApp } from '../support/test-app'

type Agent = Awaited<ReturnType<typeof signedInAgent>>

let t: TestApp
let analyst: Agent
let reviewer: Agent
let admin: Agent
/** Signed off by the reviewer before the tests. */
let signedRun: RunDetail
let signOff: RunReview
/** Succeeded, for the queue. */
let openRun: RunDetail
/** Succeeded, reviewed with changes requested and then deleted. */
let deletableRun: RunDetail
/** Succeeded, signed off and then has its stored results altered. */
let tamperRun: RunDetail
/** Succeeded, owned by the administrator. */
let adminRun: RunDetail
/** Stopped before it finished. */
let cancelledRun: RunDetail
let profileId: number

async function submit(a: Agent, name: string): Promise<number> {
  return (await a.post('/api/runs', { name, profileId, settings: QUICK_RUN_SETTINGS }).expect(202))
    .body.run.id
}

beforeAll(async () => {
  t = await createTestApp({ runs: { threads: 1 } })
  analyst = await signedInAgent(t, 'analyst')
  reviewer = await signedInAgent(t, 'reviewer')
  admin = await signedInAgent(t, 'admin')
  profileId = await createPresetProfile(analyst)
  const ids = {
    signed: await submit(analyst, 'Signed run'),
    open: await submit(analyst, 'Open run'),
    deletable: await submit(analyst, 'Deletable run'),
    tamper: await submit(analyst, 'Tamper run'),
    admin: await submit(admin, 'Admin run'),
    cancelled: await submit(analyst, 'Cancelled run'),
  }
  cancelledRun = (await analyst.post(`/api/runs/${ids.cancelled}/cancel`).expect(200)).body.run
  signedRun = await waitForRun(analyst, ids.signed)
  openRun = await waitForRun(analyst, ids.open)
  deletableRun = await waitForRun(analyst, ids.deletable)
  tamperRun = await waitForRun(analyst, ids.tamper)
  adminRun = await waitForRun(admin, ids.admin)
  for (const run of [signedRun, openRun, deletableRun, tamperRun, adminRun]) {
    expect(run.status).toBe('succeeded')
  }
  signOff = (
    await reviewer
      .post(`/api/runs/${signedRun.id}/reviews`, {
        state: 'signed-off',
        comment: 'Fluxes and band centre look right.',
      })
      .expect(201)
  ).body.review
}, 240_000)

afterAll(async () => {
  await t?.close()
})

describe('reviews API', () => {
  it('when a reviewer signs off a succeeded run, returns the review with a signature over the documented record', async () => {
    expect(signOff).toMatchObject({
      runId: signedRun.id,
      state: 'signed-off',
      comment: 'Fluxes and band centre look right.',
      reviewerName: 'Tomas Okafor',
    })
    const stored = await RunResult.findByPk(signedRun.id)
    const digest = createHash('sha256')
      .update(canonicalJson({ summary: stored!.summary, data: stored!.data }))
      .digest('hex')
    expect(signOff.resultsDigest).toBe(digest)
    const record = {
      runId: signedRun.id,
      inputHash: signedRun.inputHash,
      engineVersion: signedRun.engineVersion,
      resultsDigest: digest,
      reviewerId: signOff.reviewerId,
      state: 'signed-off',
      comment: 'Fluxes and band centre look right.',
      signedAt: signOff.signedAt,
    }
    expect(signOff.signature).toBe(createHash('sha256').update(canonicalJson(record)).digest('hex'))
  })

  it('when the stored run and results are unchanged, verify answers valid with matching parts', async () => {
    const res = await analyst.get(`/api/runs/${signedRun.id}/reviews/verify`).expect(200)
    expect(res.body).toMatchObject({
      runId: signedRun.id,
      reviewId: signOff.id,
      state: 'signed-off',
      valid: true,
      signature: signOff.signature,
      recomputedSignature: signOff.signature,
      resultsDigest: signOff.resultsDigest,
      recomputedResultsDigest: signOff.resultsDigest,
      inputHash: signedRun.inputHash,
      recomputedInputHash: signedRun.inputHash,
    })
  })

  it('when a run is signed off, its detail, the run list and its review list say so', async () => {
    const detail = (await analyst.get(`/api/runs/${signedRun.id}`).expect(200)).body.run
    expect(detail).toMatchObject({
      signedOff: true,
      signedOffBy: 'Tomas Okafor',
      signedOffAt: signOff.signedAt,
    })
    const list = (await analyst.get('/api/runs?pageSize=100').expect(200)).body
      .items as RunSummary[]
    expect(list.find((r) => r.id === signedRun.id)?.signedOff).toBe(true)
    expect(list.find((r) => r.id === openRun.id)).toMatchObject({
      signedOff: false,
      signedOffBy: null,
      signedOffAt: null,
    })
    const reviews = (await analyst.get(`/api/runs/${signedRun.id}/reviews`).expect(200)).body
      .reviews
    expect(reviews).toEqual([signOff])
  })

  it('when the run is already signed off, another review of either kind answers 409 RUN_SIGNED_OFF', async () => {
    for (const body of [
      { state: 'signed-off', comment: '' },
      { state: 'changes-requested', comment: 'One more look.' },
    ]) {
      const res = await admin.post(`/api/runs/${signedRun.id}/reviews`, body).expect(409)
      expect(res.body.error.code).toBe('RUN_SIGNED_OFF')
      expect(res.body.error.message).toMatch(/signed off by Tomas Okafor/)
    }
    expect(await Review.count({ where: { runId: signedRun.id } })).toBe(1)
  })

  it('when the owner or an administrator deletes a signed-off run, answers 409 RUN_SIGNED_OFF and the run stays', async () => {
    for (const who of [analyst, admin]) {
      const res = await who.delete(`/api/runs/${signedRun.id}`).expect(409)
      expect(res.body.error).toMatchObject({ code: 'RUN_SIGNED_OFF' })
      expect(res.body.error.message).toMatch(/cannot be deleted/)
    }
    await analyst.get(`/api/runs/${signedRun.id}`).expect(200)
    await analyst.get(`/api/runs/${signedRun.id}/results`).expect(200)
    // The database refuses too, whatever code path tries.
    await expect(Run.destroy({ where: { id: signedRun.id } })).rejects.toThrow(/signed off/)
    expect(await Run.count({ where: { id: signedRun.id } })).toBe(1)
  })

  it('when a run only has changes requested, it takes more reviews and its owner can delete it', async () => {
    await reviewer
      .post(`/api/runs/${deletableRun.id}/reviews`, {
        state: 'changes-requested',
        comment: 'Use a finer resolution.',
      })
      .expect(201)
    await admin
      .post(`/api/runs/${deletableRun.id}/reviews`, {
        state: 'changes-requested',
        comment: 'Agreed.',
      })
      .expect(201)
    const before = (await analyst.get(`/api/runs/${deletableRun.id}`).expect(200)).body.run
    expect(before.signedOff).toBe(false)
    await analyst.delete(`/api/runs/${deletableRun.id}`).expect(204)
    await analyst.get(`/api/runs/${deletableRun.id}`).expect(404)
    expect(await Review.count({ where: { runId: deletableRun.id } })).toBe(0)
  })

  it('when an analyst reviews or opens the queue, answers 403 and stores nothing; signed out, 401', async () => {
    await analyst
      .post(`/api/runs/${openRun.id}/reviews`, { state: 'signed-off', comment: '' })
      .expect(403)
    await analyst.get('/api/reviews/queue').expect(403)
    await request(t.app).get('/api/reviews/queue').expect(401)
    await request(t.app).get(`/api/runs/${openRun.id}/reviews`).expect(401)
    expect(await Review.count({ where: { runId: openRun.id } })).toBe(0)
  })

  it('when a reviewer reviews their own run, answers 403', async () => {
    const res = await admin
      .post(`/api/runs/${adminRun.id}/reviews`, { state: 'signed-off', comment: '' })
      .expect(403)
    expect(res.body.error.message).toMatch(/your own run/)
    expect(await Review.count({ where: { runId: adminRun.id } })).toBe(0)
  })

  it('when the run did not succeed, answers 409; when it or its review does not exist, 404', async () => {
    expect(cancelledRun.status).toBe('cancelled')
    const res = await reviewer
      .post(`/api/runs/${cancelledRun.id}/reviews`, { state: 'signed-off', comment: '' })
      .expect(409)
    expect(res.body.error.message).toMatch(/cancelled/)
    await reviewer
      .post('/api/runs/999999/reviews', { state: 'signed-off', comment: '' })
      .expect(404)
    await reviewer.get('/api/runs/999999/reviews').expect(404)
    await reviewer.get(`/api/runs/${adminRun.id}/reviews/verify`).expect(404)
  })

  it('the queue lists succeeded runs without a sign-off, with their latest review', async () => {
    await reviewer
      .post(`/api/runs/${openRun.id}/reviews`, {
        state: 'changes-requested',
        comment: 'Name the mixture.',
      })
      .expect(201)
    const res = await reviewer.get('/api/reviews/queue?page=1&pageSize=50').expect(200)
    const items = res.body.items as ReviewQueueItem[]
    const ids = items.map((i) => i.runId)
    expect(ids).toContain(openRun.id)
    expect(ids).toContain(adminRun.id)
    expect(ids).not.toContain(signedRun.id)
    expect(ids).not.toContain(cancelledRun.id)
    expect(res.body).toMatchObject({ page: 1, pageSize: 50, total: items.length })
    expect(items.find((i) => i.runId === openRun.id)).toMatchObject({
      name: 'Open run',
      ownerName: 'Ines Varga',
      finishedAt: openRun.finishedAt,
      reviewCount: 1,
      latestReview: { state: 'changes-requested', reviewerName: 'Tomas Okafor' },
    })
    expect(items.find((i) => i.runId === openRun.id)?.olrWPerM2).toBeGreaterThan(0)
    expect(items.find((i) => i.runId === adminRun.id)?.latestReview).toBeNull()
    const searched = await reviewer.get('/api/reviews/queue?search=admin').expect(200)
    expect(searched.body.items.map((i: ReviewQueueItem) => i.runId)).toEqual([adminRun.id])
  })

  it('when the stored results change after the sign-off, verify answers valid: false', async () => {
    const review = (
      await reviewer
        .post(`/api/runs/${tamperRun.id}/reviews`, { state: 'signed-off', comment: '' })
        .expect(201)
    ).body.review as RunReview
    expect((await reviewer.get(`/api/runs/${tamperRun.id}/reviews/verify`)).body.valid).toBe(true)

    const stored = await RunResult.findByPk(tamperRun.id)
    const data = structuredClone(stored!.data) as { spectrum: { olrSpectral: number[] } }
    data.spectrum.olrSpectral[5] = data.spectrum.olrSpectral[5]! * 1.001
    await RunResult.update({ data }, { where: { runId: tamperRun.id } })

    const res = await reviewer.get(`/api/runs/${tamperRun.id}/reviews/verify`).expect(200)
    expect(res.body).toMatchObject({
      valid: false,
      signature: review.signature,
      resultsDigest: review.resultsDigest,
      inputHash: tamperRun.inputHash,
      recomputedInputHash: tamperRun.inputHash,
    })
    expect(res.body.recomputedResultsDigest).not.toBe(review.resultsDigest)
    expect(res.body.recomputedSignature).not.toBe(review.signature)
  })

  it.each([
    ['an unknown state', { state: 'approved', comment: '' }, 'state'],
    ['no state', { comment: 'Fine.' }, 'state'],
    [
      'changes requested without a comment',
      { state: 'changes-requested', comment: '   ' },
      'comment',
    ],
    [
      'a comment over 4000 characters',
      { state: 'signed-off', comment: 'x'.repeat(4001) },
      'comment',
    ],
    ['a comment that is not text', { state: 'signed-off', comment: 42 }, 'comment'],
  ])(
    'when the review has %s, answers 400 naming the field and stores nothing',
    async (_label, body, field) => {
      const res = await reviewer.post(`/api/runs/${openRun.id}/reviews`, body).expect(400)
      expect(res.body.error.code).toBe('VALIDATION_FAILED')
      expect(res.body.error.details.fields.map((f: { field: string }) => f.field)).toContain(field)
      expect(await Review.count({ where: { runId: openRun.id, state: 'signed-off' } })).toBe(0)
    },
  )
})
