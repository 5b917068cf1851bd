import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import type request from 'supertest';
import { Advisory } from '../../api/advisories/advisory.model';
import { Decision } from '../../api/board/board.models';
import { Subscription } from '../../api/subscriptions/subscription.models';
import { queueDigests } from '../../api/mail/digest';
import { OutboxMail } from '../../api/mail/outbox.model';
import { User } from '../../api/users/user.model';
import { submittedProposal } from './support/decided';
import { mailboxMark, received, recipients } from './support/mailbox';
import { signIn, testApp, testConfig, type SignedIn } from './support/test-app';

const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('quota board, decisions and advisories', () => {
  let app: Express;
  let assessor: SignedIn;
  let chair: SignedIn;
  let odhran: SignedIn;
  let ana: SignedIn;
  const other = (email: string) => signIn(app, { email, password: 'corran-firth-demo' });

  beforeAll(async () => {
    app = await testApp();
    assessor = await signIn(app, 'assessor');
    chair = await other('maren.holt@corran-firth.example');
    odhran = await other('odhran.pike@corran-firth.example');
    ana = await other('ana.lusk@corran-firth.example');
  });

  const vote = (who: SignedIn, id: number, choice: string) =>
    who.agent.post(`/api/proposals/${id}/board/votes`).set('x-csrf-token', who.csrf).send({ choice, reason: `I ${choice}: figures checked.` });
  const decide = (who: SignedIn, id: number, body: Record<string, unknown>) =>
    who.agent.post(`/api/proposals/${id}/board/decision`).set('x-csrf-token', who.csrf).send({ reason: 'The board weighed the margin to the fold.', ...body });

  it('e-mails every board member, and only them, when a proposal is submitted', async () => {
    const mark = await mailboxMark();
    const { proposalId } = await submittedProposal(assessor, 'silver-smelt');
    await app.locals.mail.flush();
    const mails = (await received(mark)).filter((m) => m.subject?.includes(`#${proposalId} `));
    expect(mails.flatMap(recipients).sort()).toEqual(['ana.lusk@corran-firth.example', 'maren.holt@corran-firth.example', 'odhran.pike@corran-firth.example']);
    // each carries a link that opens the proposal
    for (const m of mails) expect(m.text).toContain(`${testConfig().PUBLIC_URL}/proposals/${proposalId}`);
  });

  it('applies the quorum the administrator sets, which no board member may change', async () => {
    const admin = await signIn(app, 'admin');
    await chair.agent.put('/api/board/rules').set('x-csrf-token', chair.csrf).send({ quorum: 1, majority: 0.5 }).expect(403);
    const { proposalId } = await submittedProposal(assessor, 'red-grouse');
    await vote(odhran, proposalId, 'approve').expect(201);
    await vote(ana, proposalId, 'approve').expect(201);
    try {
      await admin.agent.put('/api/board/rules').set('x-csrf-token', admin.csrf).send({ quorum: 3, majority: 0.6 }).expect(200);
      const res = await decide(chair, proposalId, { outcome: 'approved' }).expect(409);
      expect(res.body.error.message).toContain('quorum is 3');
      expect((await admin.agent.put('/api/board/rules').set('x-csrf-token', admin.csrf).send({ quorum: 0, majority: 0.4 }).expect(400)).body.error.fields).toEqual(jasmine.objectContaining({ quorum: jasmine.any(Array), majority: jasmine.any(Array) }));
    } finally {
      await admin.agent.put('/api/board/rules').set('x-csrf-token', admin.csrf).send({ quorum: 2, majority: 0.5 }).expect(200);
    }
    await decide(chair, proposalId, { outcome: 'approved' }).expect(201);
  });

  it('refuses a decision before quorum, from a member who is not the chair, and against the votes', async () => {
    const { proposalId } = await submittedProposal(assessor, 'red-grouse');
    expect((await vote(odhran, proposalId, 'approve').expect(201)).body.vote.choice).toBe('approve');
    expect((await decide(chair, proposalId, { outcome: 'approved' }).expect(409)).body.error.code).toBe('QUORUM_NOT_MET');
    await vote(ana, proposalId, 'reject').expect(201);
    await vote(chair, proposalId, 'reject').expect(201);
    expect((await decide(odhran, proposalId, { outcome: 'rejected' }).expect(403)).body.error.message).toContain('chair');
    expect((await decide(chair, proposalId, { outcome: 'approved' }).expect(409)).body.error.code).toBe('OUTCOME_AGAINST_VOTES');
    const rejected = await decide(chair, proposalId, { outcome: 'rejected' }).expect(201);
    expect(rejected.body.advisoryId).toBeNull();
    expect((await vote(ana, proposalId, 'approve').expect(409)).body.error.code).toBe('ALREADY_DECIDED');
    const view = await assessor.agent.get(`/api/proposals/${proposalId}/board`).expect(200);
    expect(view.body.decision.votes).toEqual({ approve: 1, reject: 2, abstain: 0 });
    const actions = view.body.audit.map((a: { action: string }) => a.action);
    expect(actions).toEqual(jasmine.arrayContaining(['proposal.submit', 'proposal.vote', 'proposal.rejected']));
    expect(view.body.audit.find((a: { action: string }) => a.action === 'proposal.rejected').actorName).toBe('Maren Holt');
  });

  it('needs an explicit override for a limit above the lower 5% of the fold, and flags it in the advisory', async () => {
    const { proposalId, lower5 } = await submittedProposal(assessor, 'red-grouse');
    await vote(odhran, proposalId, 'approve').expect(201);
    await vote(chair, proposalId, 'approve').expect(201);
    const refused = await decide(chair, proposalId, { outcome: 'approved', limit: Math.round(lower5 * 1.05) }).expect(422);
    expect(refused.body.error.code).toBe('OVERRIDE_REQUIRED');
    expect(await Decision.count({ where: { proposalId } })).toBe(0);
    const ok = await decide(chair, proposalId, { outcome: 'approved', limit: Math.round(lower5 * 1.05), override: true }).expect(201);
    const advisory = await Advisory.findByPk(ok.body.advisoryId);
    expect(advisory!.override).toBeTrue();
    const text = pdfText(advisory!.pdf);
    expect(text).toContain('OVERRIDE');
  });

  it('under a rule that needs a vote, refuses the chair alone and records a correction by the new vote on a revision', async () => {
    const admin = await signIn(app, 'admin');
    const { proposalId, lower5 } = await submittedProposal(assessor, 'red-grouse', 0.9);
    await vote(odhran, proposalId, 'approve').expect(201);
    await vote(ana, proposalId, 'reject').expect(201);
    await vote(chair, proposalId, 'approve').expect(201);
    const first = await decide(chair, proposalId, { outcome: 'approved' }).expect(201);
    try {
      await admin.agent.put('/api/board/rules').set('x-csrf-token', admin.csrf).send({ quorum: 2, majority: 0.5, chairMayCorrect: false }).expect(200);
      const refused = await chair.agent.post(`/api/advisories/${first.body.advisoryId}/supersede`).set('x-csrf-token', chair.csrf).send({ limit: Math.round(lower5 * 0.7), reason: 'Chair would lower it alone.' }).expect(409);
      expect(refused.body.error.code).toBe('CORRECTION_NEEDS_VOTE');
      expect((await Advisory.findByPk(first.body.advisoryId))!.supersededById).toBeNull();
      const revised = await assessor.agent.post(`/api/proposals/${proposalId}/revise`).set('x-csrf-token', assessor.csrf).expect(201);
      const rid = revised.body.proposal.id as number;
      const lower = Math.round(lower5 * 0.7);
      await assessor.agent.patch(`/api/proposals/${rid}`).set('x-csrf-token', assessor.csrf).send({ quota: lower }).expect(200);
      await assessor.agent.post(`/api/proposals/${rid}/submit`).set('x-csrf-token', assessor.csrf).expect(200);
      await vote(odhran, rid, 'approve').expect(201);
      await vote(ana, rid, 'approve').expect(201);
      await vote(chair, rid, 'abstain').expect(201);
      const second = await decide(chair, rid, { outcome: 'approved', reason: 'Survey revision lowers the fold; corrected by a new vote.' }).expect(201);
      const a = (await Advisory.findByPk(second.body.advisoryId))!;
      expect(a.supersedesId).toBe(first.body.advisoryId);
      const text = pdfText(a.pdf);
      expect(text).toContain('Correction by a new board vote');
      expect(text).toContain('Votes on the correction: 2 approve, 0 reject, 1 abstain');
      expect(text).toContain('(2 approve, 1 reject, 0 abstain); those votes were on that limit');
      const original = (await assessor.agent.get(`/api/proposals/${proposalId}/board`).expect(200)).body;
      expect(original.corrections).toEqual([jasmine.objectContaining({ kind: 'vote', correctedLimit: lower, votes: { approve: 2, reject: 0, abstain: 1 }, viaProposalId: rid })]);
      expect(original.decision.advisoryId).toBe(a.id);
      const revisedView = (await assessor.agent.get(`/api/proposals/${rid}/board`).expect(200)).body;
      expect(revisedView.decision.corrects).toEqual(jasmine.objectContaining({ proposalId, limit: first.body.advisoryId ? (await Advisory.findByPk(first.body.advisoryId))!.approvedLimit : 0 }));
    } finally {
      await admin.agent.put('/api/board/rules').set('x-csrf-token', admin.csrf).send({ quorum: 2, majority: 0.5, chairMayCorrect: true }).expect(200);
    }
  });

  describe('a published advisory', () => {
    let advisoryId: number;
    let limit: number;
    let moorfellSub: Subscription;
    let expectedRecipients: string[];
    let proposalOfAdvisory: number;
    let correctionsOnly: User;
    let digestReader: User;
    let stockOfAdvisory: number;
    let mark: ReadonlySet<string>;

    beforeAll(async () => {
      mark = await mailboxMark();
      const keeper = (await User.findOne({ where: { email: 'keeper@moorfell-estate.example' } }))!;
      moorfellSub = await Subscription.create({ userId: keeper.id, regionId: keeper.regionId!, plan: 'yearly', stripeCustomerId: 'cus_test', stripeCheckoutId: `cs_test_${Date.now()}`, stripeSubscriptionId: null, status: 'active', currentPeriodEnd: new Date(Date.now() + 30 * 86_400_000) });
      // two more Moorfell licensees who chose less mail: corrections only, and the weekly digest
      const tag = Date.now().toString(36);
      const reader = async (name: string, mailPreference: 'corrections' | 'digest') => {
        const u = await User.create({ email: `${mailPreference}.${tag}@moorfell-estate.example`, name, role: 'licensee', passwordHash: 'x', organisation: null, regionId: keeper.regionId!, mailPreference });
        await Subscription.create({ userId: u.id, regionId: keeper.regionId!, plan: 'yearly', stripeCustomerId: `cus_${mailPreference}`, stripeCheckoutId: `cs_test_${mailPreference}_${tag}`, stripeSubscriptionId: null, status: 'active', currentPeriodEnd: new Date(Date.now() + 30 * 86_400_000) });
        return u;
      };
      correctionsOnly = await reader('Moorfell Low Beat', 'corrections');
      digestReader = await reader('Moorfell High Beat', 'digest');
      const { proposalId, lower5, stock } = await submittedProposal(assessor, 'red-grouse', 0.9);
      proposalOfAdvisory = proposalId;
      stockOfAdvisory = stock.id;
      await vote(odhran, proposalId, 'approve').expect(201);
      await vote(ana, proposalId, 'abstain').expect(201);
      limit = Math.round(lower5 * 0.85);
      const live = (await Subscription.findAll({ where: { regionId: keeper.regionId! } })).filter((x) => x.grantsAccess());
      expectedRecipients = (await User.findAll({ where: { id: live.map((x) => x.userId), mailPreference: 'every' } })).map((u) => u.email).sort();
      const res = await decide(chair, proposalId, { outcome: 'approved', limit, reason: 'Lowered below the proposal to keep a wider margin.' }).expect(201);
      advisoryId = res.body.advisoryId;
      await app.locals.mail.flush();
    });

    it('is a PDF whose text has the limit, the margin to the fold, the votes and the caution, with Source Sans 3 embedded', async () => {
      const a = (await Advisory.findByPk(advisoryId))!;
      const text = pdfText(a.pdf);
      expect(text).toContain(`${limit.toLocaleString('en-GB')} birds per year`);
      expect(text).toContain('Margin to the fold');
      expect(text).toContain('1 approve, 0 reject, 1 abstain');
      expect(text).toContain('scientific advice to a competent authority');
      expect(text).toContain(a.docId);
      const fonts = pdfFonts(a.pdf);
      expect(fonts).toMatch(/SourceSans3[^\n]*yes/);
      expect(fonts.split('\n').filter((l) => /SourceSans3/.test(l)).every((l) => /\byes\b/.test(l))).toBeTrue();
    });

    it('is downloaded byte for byte as stored, with its SHA-256', async () => {
      const res = await assessor.agent.get(`/api/advisories/${advisoryId}/pdf`).buffer(true).parse(binary).expect(200);
      const sha = createHash('sha256').update(res.body as Buffer).digest('hex');
      expect(res.headers['x-content-sha256']).toBe(sha);
      expect((await Advisory.findByPk(advisoryId))!.sha256).toBe(sha);
    });

    it('goes by e-mail, with the PDF, to the region\'s active subscribers only', async () => {
      const mails = (await received(mark)).filter((m) => m.attachments.some((x) => x.contentType === 'application/pdf') && m.text?.includes(`${limit.toLocaleString('en-GB')} birds`));
      expect(expectedRecipients).toContain('keeper@moorfell-estate.example');
      expect(mails.flatMap(recipients).sort()).toEqual(expectedRecipients);
      expect(mails.flatMap(recipients)).not.toContain('office@inner-firth-potters.example');
      expect(mails.flatMap(recipients)).not.toContain(correctionsOnly.email);
      expect(mails.flatMap(recipients)).not.toContain(digestReader.email);
    });

    it('cannot be changed; a correction is a new advisory that supersedes it', async () => {
      await chair.agent.patch(`/api/advisories/${advisoryId}`).set('x-csrf-token', chair.csrf).send({ approvedLimit: 1 }).expect(404);
      await chair.agent.delete(`/api/advisories/${advisoryId}`).set('x-csrf-token', chair.csrf).expect(404);
      const before = (await Advisory.findByPk(advisoryId))!;
      expect((await odhran.agent.post(`/api/advisories/${advisoryId}/supersede`).set('x-csrf-token', odhran.csrf).send({ limit: limit - 50, reason: 'Typing error in the limit.' }).expect(403)).body.error.code).toBe('FORBIDDEN');
      const corr = await chair.agent.post(`/api/advisories/${advisoryId}/supersede`).set('x-csrf-token', chair.csrf).send({ limit: limit - 50, reason: 'Limit corrected after a landing record was revised.' }).expect(201);
      expect(corr.body.advisory.supersedesId).toBe(advisoryId);
      const after = (await Advisory.findByPk(advisoryId))!;
      expect(after.sha256).toBe(before.sha256);
      expect(after.approvedLimit).toBe(before.approvedLimit);
      expect(after.supersededById).toBe(corr.body.advisory.id);
      expect(pdfText((await Advisory.findByPk(corr.body.advisory.id))!.pdf)).toContain(`supersedes ${before.docId}`);
      // the correction carries its own decision record: the chair alone, its own reason, no votes passed off as its own
      const corrected = pdfText((await Advisory.findByPk(corr.body.advisory.id))!.pdf);
      expect(corrected).toContain('Correction by the chair (no board vote)');
      expect(corrected).toContain('Reason for the correction: Limit corrected after a landing record was revised.');
      expect(corrected).toContain('those votes were on that limit, not on this one');
      expect(corrected).not.toContain('Board decision');
      const board = (await assessor.agent.get(`/api/proposals/${proposalOfAdvisory}/board`).expect(200)).body;
      expect(board.corrections).toEqual([jasmine.objectContaining({ kind: 'chair', correctedLimit: limit - 50, previousLimit: limit, votes: null, reason: 'Limit corrected after a landing record was revised.' })]);
      expect(board.decision.advisoryId).toBe(corr.body.advisory.id);
      expect(board.audit.map((e: { action: string }) => e.action)).toContain('proposal.correct.chair');
      const listed = (await assessor.agent.get(`/api/stocks/${stockOfAdvisory}/proposals`).expect(200)).body.proposals.find((p: { id: number }) => p.id === proposalOfAdvisory);
      expect(listed.standing).toEqual(jasmine.objectContaining({ outcome: 'approved', limit: limit - 50, corrected: true }));
      // the correction goes to those who asked for every advisory and to those who asked for corrections only
      const queued = await OutboxMail.findAll({ where: { advisoryId: corr.body.advisory.id } });
      expect(queued.map((m) => m.toAddress)).toContain(correctionsOnly.email);
      expect(queued.map((m) => m.toAddress)).not.toContain(digestReader.email);
      expect(queued.find((m) => m.toAddress === correctionsOnly.email)!.subject).toContain(`Correction to harvest advisory ${before.docId}`);
      // the digest reader gets both, once, in the weekly digest
      expect(await queueDigests(User.sequelize!, 'http://brinkmark.test')).toBeGreaterThanOrEqual(1);
      const digest = await OutboxMail.findAll({ where: { toAddress: digestReader.email } });
      expect(digest.length).toBe(1);
      expect(digest[0]!.body).toContain(before.docId);
      expect(digest[0]!.body).toContain(`${corr.body.advisory.docId} (correction)`);
      await queueDigests(User.sequelize!, 'http://brinkmark.test');
      expect(await OutboxMail.count({ where: { toAddress: digestReader.email } })).toBe(1);
      expect((await chair.agent.post(`/api/advisories/${advisoryId}/supersede`).set('x-csrf-token', chair.csrf).send({ limit: 10, reason: 'Second correction of the old one.' }).expect(409)).body.error.code).toBe('ALREADY_SUPERSEDED');
    });

    it('lets a subscribed licensee download it and denies a licensee of another region', async () => {
      const keeper = await other('keeper@moorfell-estate.example');
      await keeper.agent.get(`/api/advisories/${advisoryId}/pdf`).expect(200);
      const list = await keeper.agent.get('/api/advisories').expect(200);
      expect(list.body.advisories.map((a: { id: number }) => a.id)).toContain(advisoryId);
      const potters = await other('office@inner-firth-potters.example');
      await potters.agent.get(`/api/advisories/${advisoryId}/pdf`).expect(403);
      expect((await potters.agent.get('/api/advisories').expect(200)).body.advisories).toEqual([]);
      await moorfellSub.update({ currentPeriodEnd: new Date(Date.now() - 1000) });
      await keeper.agent.get(`/api/advisories/${advisoryId}/pdf`).expect(403);
    });
  });
});

function withFile<T>(pdf: Buffer, f: (path: string) => T): T {
  const dir = mkdtempSync(join(tmpdir(), 'bm-pdf-'));
  const path = join(dir, 'a.pdf');
  writeFileSync(path, pdf);
  return f(path);
}

/** Text of a PDF via poppler's pdftotext (an independent reader). */
function pdfText(pdf: Buffer): string {
  return withFile(pdf, (p) => execFileSync('pdftotext', ['-layout', p, '-'], { encoding: 'utf8' })).replace(/\s+/g, ' ');
}

function pdfFonts(pdf: Buffer): string {
  return withFile(pdf, (p) => execFileSync('pdffonts', [p], { encoding: 'utf8' }));
}
