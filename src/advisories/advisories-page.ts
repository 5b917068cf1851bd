import { ChangeDetectionStrategy, Component } from '@angular/core';
import { AdvisoryList } from './advisory-list';

@Component({
  selector: 'bm-advisories-page',
  imports: [AdvisoryList],
  template: `<h1 class="bm-title">Advisories</h1><p class="bm-lead">Published harvest limits. Each PDF is immutable; a correction is published as a new advisory that supersedes the old one.</p><bm-advisory-list />`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AdvisoriesPage {}
