import { HttpErrorResponse } from '@angular/common/http';
import { signal } from '@angular/core';
import { FormControl, FormGroup, Validators } from '@angular/forms';
import { Subject, of, throwError } from 'rxjs';
import { fieldError, saveWithFieldErrors } from './register-form';

function registerForm() {
  return new FormGroup({
    name: new FormControl('Fridge', { validators: [Validators.required, Validators.maxLength(40)] }),
    capacityAh: new FormControl<number | null>(200, { validators: [Validators.min(1)] }),
    deviceId: new FormControl('', { validators: [Validators.pattern(/^[a-z0-9-]*$/)] }),
  });
}
const state = () => ({ saving: signal(false), problem: signal<string | null>(null) });
const refusal = (field: string, message: string) =>
  new HttpErrorResponse({
    status: 422,
    url: '/api/systems/van-1/install/components',
    error: { error: { code: 'invalid', message, field } },
  });

describe('saveWithFieldErrors', () => {
  it('sends nothing while the form breaks a rule, and marks every field touched so the words show', () => {
    const form = registerForm();
    form.controls.name.setValue('');
    const request = jest.fn(() => of({ id: 'c1' }));
    saveWithFieldErrors(form, state(), { request, controlFor: (f) => f, saved: jest.fn() });
    expect(request).not.toHaveBeenCalled();
    expect(form.controls.name.touched).toBe(true);
  });

  it('hands the stored record on and clears the saving mark', () => {
    const s = state();
    const saved = jest.fn();
    saveWithFieldErrors(registerForm(), s, { request: () => of({ id: 'c1' }), controlFor: (f) => f, saved });
    expect(saved).toHaveBeenCalledWith({ id: 'c1' });
    expect(s.saving()).toBe(false);
    expect(s.problem()).toBeNull();
  });

  it('does not send twice while a save is under way', () => {
    const answer = new Subject<{ id: string }>();
    const request = jest.fn(() => answer);
    const s = state();
    const form = registerForm();
    saveWithFieldErrors(form, s, { request, controlFor: (f) => f, saved: jest.fn() });
    saveWithFieldErrors(form, s, { request, controlFor: (f) => f, saved: jest.fn() });
    expect(request).toHaveBeenCalledTimes(1);
    expect(s.saving()).toBe(true);
  });

  it('puts the server’s words under the control its field maps to, and above the buttons', () => {
    const form = registerForm();
    const s = state();
    saveWithFieldErrors(form, s, {
      request: () =>
        throwError(() => refusal('ratings.capacityAh', 'capacityAh must be at most 5000 Ah; got 9000')),
      controlFor: (field) => field.replace(/^ratings\./, ''),
      saved: jest.fn(),
    });
    expect(form.controls.capacityAh.getError('server')).toBe('capacityAh must be at most 5000 Ah; got 9000');
    expect(s.problem()).toBe('capacityAh must be at most 5000 Ah; got 9000');
    expect(s.saving()).toBe(false);
  });

  it('shows a refusal for a field no control holds above the buttons only', () => {
    const form = registerForm();
    const s = state();
    saveWithFieldErrors(form, s, {
      request: () =>
        throwError(() => refusal('componentId', 'componentId names no component of this system')),
      controlFor: () => null,
      saved: jest.fn(),
    });
    expect(form.valid).toBe(true);
    expect(s.problem()).toBe('componentId names no component of this system');
  });
});

describe('fieldError', () => {
  it('says nothing about a field not yet touched', () => {
    const form = registerForm();
    form.controls.name.setValue('');
    expect(fieldError(form, 'name', 'Name')).toBeNull();
  });

  it('names the first broken rule with the field’s label, the server’s words first', () => {
    const form = registerForm();
    form.markAllAsTouched();
    form.controls.name.setValue('');
    expect(fieldError(form, 'name', 'Name')).toBe('Name is required.');
    form.controls.capacityAh.setValue(0);
    expect(fieldError(form, 'capacityAh', 'Capacity')).toBe('Capacity must be at least 1.');
    form.controls.name.setValue('x'.repeat(41));
    expect(fieldError(form, 'name', 'Name')).toBe('Name is too long.');
    form.controls.name.setErrors({ server: 'name is already used in this register' });
    expect(fieldError(form, 'name', 'Name')).toBe('name is already used in this register');
  });

  it('says what a pattern allows when the editor names it, and a plain sentence otherwise', () => {
    const form = registerForm();
    form.markAllAsTouched();
    form.controls.deviceId.setValue('Van Shunt');
    expect(fieldError(form, 'deviceId', 'Monitor id', 'lower-case letters, digits and dashes')).toBe(
      'Monitor id: lower-case letters, digits and dashes.',
    );
    expect(fieldError(form, 'deviceId', 'Monitor id')).toBe('Monitor id is not valid.');
  });
});
