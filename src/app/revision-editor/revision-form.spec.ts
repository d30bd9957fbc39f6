import { demoLightTwinJetContent } from '@shared/speed-book/demo-content';
import { RevisionForm } from './revision-form';

// Issue 11: a draft saved from the editor keeps the content fields the form has no control for.
describe('RevisionForm carries the fields it does not edit', () => {
  it('writes back the envelope, rule exceptions, reference stall speeds, TAT recovery factor and each speed’s class', () => {
    const content = demoLightTwinJetContent();
    content.ruleExceptions = [{ ruleId: 'vx-vy', reason: 'Flight manual section 4.' }];
    content.statesReferenceStallSpeeds = true;
    content.aircraft.tatRecoveryFactor = 0.9;
    content.speeds[1] = { ...content.speeds[1], code: 'VSO', speedClass: 'stall' };
    const form = new RevisionForm();
    form.load(content as never);
    const written = form.content() as typeof content;
    expect(written.envelope).toEqual(content.envelope);
    expect(written.ruleExceptions).toEqual(content.ruleExceptions);
    expect(written.statesReferenceStallSpeeds).toBe(true);
    expect(written.aircraft.tatRecoveryFactor).toBe(0.9);
    expect(written.speeds[1]).toMatchObject({ code: 'VSO', speedClass: 'stall' });
    expect(written.speeds[0].speedClass).toBeUndefined();
  });

  it('keeps a speed’s class with its own row when a row above it is removed', () => {
    const content = demoLightTwinJetContent();
    content.speeds[1] = { ...content.speeds[1], speedClass: 'stall' };
    const form = new RevisionForm();
    form.load(content as never);
    form.speeds.removeAt(0);
    const written = form.content() as typeof content;
    expect(written.speeds[0]).toMatchObject({ code: 'VS0', speedClass: 'stall' });
    expect(written.speeds.filter((speed) => speed.speedClass !== undefined)).toHaveLength(1);
  });
});
