import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterLink } from '@angular/router';

@Component({
  selector: 'bm-not-found',
  imports: [RouterLink],
  template: `<h1 class="bm-title">Page not found</h1><p class="bm-lead">There is no page at this address. <a routerLink="/">Go to your home page</a>.</p>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFound {}
