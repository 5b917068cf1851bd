import type { Role } from '../../api/users/user.schemas';

export interface HomeAction {
  icon: string;
  title: string;
  text: string;
  link: string | null;
}

/** What each kind of person can do next, as shown on their home page. */
export const HOME_ACTIONS: Record<Role, { lead: string; actions: HomeAction[] }> = {
  assessor: {
    lead: 'Load survey and catch series, fit population models, and draft quota proposals with their margin to the fold.',
    actions: [
      { icon: 'set_meal', title: 'Stocks', text: 'Open a stock to see its dataset versions and model runs.', link: '/stocks' },
      { icon: 'upload_file', title: 'Load a dataset', text: 'Upload catches and survey indices as CSV; every row is checked before it is saved.', link: '/stocks' },
      { icon: 'insights', title: 'Fit and read the fold', text: 'Fit Schaefer, Pella-Tomlinson, Fox or predator-prey models and read where harvest tips the stock.', link: '/stocks' },
    ],
  },
  board: {
    lead: 'Review submitted quota proposals, discuss them, vote, and record the decision on each limit.',
    actions: [
      { icon: 'fact_check', title: 'Proposals to review', text: 'Proposals submitted by assessors, with their runs, charts and risk tables; comment, vote, decide.', link: '/board' },
      { icon: 'set_meal', title: 'Stocks', text: 'Every managed stock and its latest assessment.', link: '/stocks' },
    ],
  },
  licensee: {
    lead: 'Read the published advisories for the regions your licence covers.',
    actions: [
      { icon: 'set_meal', title: 'My stocks', text: 'The stocks of your region.', link: '/stocks' },
      { icon: 'description', title: 'Advisories and subscription', text: 'Published harvest limits for your regions, newest first; your plan, renewal and invoices.', link: '/portal' },
    ],
  },
  admin: {
    lead: 'Manage the people who use Brinkmark and what each may do.',
    actions: [
      { icon: 'manage_accounts', title: 'People and roles', text: 'Create accounts, set roles and regions, deactivate access.', link: '/admin/users' },
      { icon: 'set_meal', title: 'Stocks', text: 'Stocks and regions of the agency.', link: '/stocks' },
      { icon: 'outgoing_mail', title: 'Mail outbox', text: 'Every e-mail queued and sent, with retries and errors.', link: '/admin/mail' },
    ],
  },
};
