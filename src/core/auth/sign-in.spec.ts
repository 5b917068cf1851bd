import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter, Router } from '@angular/router';
import { ApiError } from '../errors/api-error';
import { AuthStore } from './auth-store';
import { SignIn } from './sign-in';

describe('SignIn', () => {
  let auth: jasmine.SpyObj<AuthStore>;

  async function setup() {
    auth = jasmine.createSpyObj<AuthStore>('AuthStore', ['signIn']);
    TestBed.configureTestingModule({
      imports: [SignIn],
      providers: [provideRouter([]), { provide: AuthStore, useValue: auth }],
    });
    const fixture = TestBed.createComponent(SignIn);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    return { fixture, loader };
  }

  async function fieldErrors(loader: Awaited<ReturnType<typeof setup>>['loader'], label: string): Promise<string[]> {
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
    return field.getTextErrors();
  }

  it('shows both required-field errors and does not call the server when submitted empty', async () => {
    const { loader } = await setup();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    expect(await fieldErrors(loader, 'E-mail')).toEqual(['Enter your e-mail address.']);
    expect(await fieldErrors(loader, 'Password')).toEqual(['Enter your password.']);
    expect(auth.signIn).not.toHaveBeenCalled();
  });

  it('rejects an address that is not an e-mail', async () => {
    const { loader } = await setup();
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid=email]' }))).setValue('maren.holt');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid=password]' }))).setValue('secret');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    expect(await fieldErrors(loader, 'E-mail')).toEqual(['This is not a valid e-mail address.']);
    expect(auth.signIn).not.toHaveBeenCalled();
  });

  it('signs in with the trimmed address and goes home', async () => {
    const { loader } = await setup();
    const router = TestBed.inject(Router);
    const nav = spyOn(router, 'navigateByUrl').and.resolveTo(true);
    auth.signIn.and.resolveTo({} as never);
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid=email]' }))).setValue(' maren.holt@corran-firth.example ');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid=password]' }))).setValue('secret');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    expect(auth.signIn).toHaveBeenCalledOnceWith('maren.holt@corran-firth.example', 'secret');
    expect(nav).toHaveBeenCalledWith('/');
  });

  it('shows the server\'s message when the password is wrong', async () => {
    const { fixture, loader } = await setup();
    auth.signIn.and.rejectWith(new ApiError(401, 'SIGN_IN_FAILED', 'The e-mail or password is not correct.'));
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid=email]' }))).setValue('maren.holt@corran-firth.example');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid=password]' }))).setValue('wrong');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    await fixture.whenStable();
    const alert = (fixture.nativeElement as HTMLElement).querySelector('[data-testid=sign-in-error]');
    expect(alert?.textContent).toContain('The e-mail or password is not correct.');
  });
});
