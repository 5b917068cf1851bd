import { ErrorHandler, Injectable, inject } from '@angular/core';
import { ApiError } from './api-error';
import { Notifier } from './notifier';

/** Uncaught errors: logged, and shown to the person in plain words. */
@Injectable()
export class AppErrorHandler implements ErrorHandler {
  private readonly notifier = inject(Notifier);

  handleError(error: unknown): void {
    console.error(error);
    const message = error instanceof ApiError ? error.message : 'Something went wrong in the page. Reload and try again.';
    this.notifier.error(message);
  }
}
