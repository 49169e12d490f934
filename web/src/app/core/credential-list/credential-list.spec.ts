import { Clipboard } from '@angular/cdk/clipboard';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { CredentialList } from './credential-list';

describe('CredentialList', () => {
  let copy: jest.Mock;
  beforeEach(() => {
    copy = jest.fn(() => true);
    TestBed.configureTestingModule({
      imports: [CredentialList],
      providers: [{ provide: Clipboard, useValue: { copy } }],
    });
  });

  function render(role?: 'alert' | 'note') {
    const fixture = TestBed.createComponent(CredentialList);
    fixture.componentRef.setInput('rows', [
      { label: 'Broker URL', value: 'mqtts://monitors.example:8883' },
      { label: 'Password', value: 'k3y-only-once-7f2a' },
    ]);
    if (role) fixture.componentRef.setInput('warningRole', role);
    fixture.detectChanges();
    return fixture;
  }

  it('lists each value under its name with a copy button named after it', async () => {
    const fixture = render();
    const element = fixture.nativeElement as HTMLElement;
    const rows = Array.from(element.querySelectorAll('.credentials .row'), (row) => [
      row.querySelector('dt')?.textContent,
      row.querySelector('code')?.textContent,
    ]);
    expect(rows).toEqual([
      ['Broker URL', 'mqtts://monitors.example:8883'],
      ['Password', 'k3y-only-once-7f2a'],
    ]);
    const buttons = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatButtonHarness);
    expect(await Promise.all(buttons.map(async (b) => (await b.host()).getAttribute('aria-label')))).toEqual([
      'Copy Broker URL',
      'Copy Password',
    ]);
  });

  it('copies a value and says which one, so the screen can announce it', async () => {
    const fixture = render();
    const said: (string | null)[] = [];
    fixture.componentInstance.copied.subscribe((label) => said.push(label));
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Copy Password"]' }))
    ).click();
    expect(copy).toHaveBeenCalledWith('k3y-only-once-7f2a');
    expect(said).toEqual(['Password']);
    copy.mockReturnValue(false);
    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Copy Broker URL"]' }))
    ).click();
    expect(said).toEqual(['Password', null]);
  });

  it('gives the shown-only-now warning the role the screen asks for', () => {
    expect((render().nativeElement as HTMLElement).querySelector('.once')?.getAttribute('role')).toBe('note');
    expect((render('alert').nativeElement as HTMLElement).querySelector('.once')?.getAttribute('role')).toBe(
      'alert',
    );
  });
});
