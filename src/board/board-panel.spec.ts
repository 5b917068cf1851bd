import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { of } from 'rxjs';
import type { BoardView } from '../../api/board/board.schemas';
import type { ProposalView } from '../../api/proposals/proposal.schemas';
import type { UserView } from '../../api/users/user.schemas';
import { AuthStore } from '../core/auth/auth-store';
import { BoardApi } from './board-api';
import { BoardPanel } from './board-panel';

const VIEW: BoardView = {
  rules: { quorum: 2, majority: 0.5, chairMayCorrect: true },
  corrections: [],
  comments: [{ id: 1, parentId: null, authorId: 5, authorName: 'Odhran Pike', body: 'Why this margin?', createdAt: '2026-12-02T10:00:00Z',
    replies: [{ id: 2, parentId: 1, authorId: 2, authorName: 'Tomas Reyl', body: 'It is the 5% quantile.', createdAt: '2026-12-02T10:05:00Z', replies: [] }] }],
  votes: [{ voterId: 5, voterName: 'Odhran Pike', choice: 'approve', reason: 'Fine.', updatedAt: '2026-12-02T10:10:00Z' }],
  decision: null,
  audit: [{ id: 9, actorName: 'Tomas Reyl', action: 'proposal.submit', entityType: 'proposal', entityId: 3, before: { status: 'draft' }, after: { status: 'submitted' }, createdAt: '2026-12-02T09:00:00Z' }],
};
const PROPOSAL = { id: 3, quota: 2300, status: 'submitted', figures: { unit: 'birds', foldHarvest: { median: 2500, lower5: 2350, upper95: 2650 } } } as unknown as ProposalView;

describe('BoardPanel', () => {
  async function render(role: 'board' | 'assessor', chair: boolean) {
    const user = signal({ role, boardChair: chair } as UserView);
    const auth = { user: user.asReadonly(), hasRole: (...r: string[]) => r.includes(role) } as unknown as AuthStore;
    const api = jasmine.createSpyObj<BoardApi>('BoardApi', ['view']);
    api.view.and.returnValue(of(VIEW));
    TestBed.configureTestingModule({ imports: [BoardPanel], providers: [{ provide: AuthStore, useValue: auth }, { provide: BoardApi, useValue: api }] });
    const fixture = TestBed.createComponent(BoardPanel);
    fixture.componentRef.setInput('proposal', PROPOSAL);
    await fixture.whenStable();
    await new Promise((r) => setTimeout(r));
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it('shows the chair the decision form and the vote form', async () => {
    const el = await render('board', true);
    expect(el.querySelector('[data-testid=record-decision]')).not.toBeNull();
    expect(el.querySelector('[data-testid=cast-vote]')).not.toBeNull();
  });

  it('lets another board member vote but not decide, and an assessor do neither', async () => {
    const member = await render('board', false);
    expect(member.querySelector('[data-testid=record-decision]')).toBeNull();
    expect(member.querySelector('[data-testid=cast-vote]')).not.toBeNull();
    TestBed.resetTestingModule();
    const assessor = await render('assessor', false);
    expect(assessor.querySelector('[data-testid=cast-vote]')).toBeNull();
  });

  it('nests replies under their comment and lists the audit trail', async () => {
    const el = await render('assessor', false);
    const nested = el.querySelector('.bm-thread .bm-thread');
    expect(nested?.textContent).toContain('It is the 5% quantile.');
    expect(el.querySelector('[data-testid=audit-log] tbody')!.textContent).toContain('proposal.submit');
  });
});
