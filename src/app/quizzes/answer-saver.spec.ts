import type { AnswerValue } from '../../../shared/api/quizzes';
import { AnswerSaver, type SaveFailure, type SaveState } from './answer-saver';

const options = { debounceMs: 500, retryDelaysMs: [1000, 2000] };
const offline: SaveFailure = { outcome: 'retry', message: 'No connection.' };

function setUp(responses: Array<'ok' | SaveFailure>) {
  const sent: Array<AnswerValue | null> = [];
  const states: SaveState[] = [];
  const saver = new AnswerSaver(
    async (answer) => {
      sent.push(answer);
      const next = responses.shift() ?? 'ok';
      if (next !== 'ok') throw next;
      return { savedAt: `t${sent.length}` };
    },
    (error) => error as SaveFailure,
    (state) => states.push(state),
    options,
  );
  return { saver, sent, states };
}

describe('AnswerSaver', () => {
  beforeEach(() => jest.useFakeTimers());
  afterEach(() => jest.useRealTimers());

  it('sends once after the quiet time, with the newest answer', async () => {
    const { saver, sent } = setUp([]);
    saver.change({ ok: true, answer: { value: 1, unit: 'cfm' } });
    await jest.advanceTimersByTimeAsync(300);
    saver.change({ ok: true, answer: { value: 12, unit: 'cfm' } });
    await jest.advanceTimersByTimeAsync(499);
    expect(sent).toEqual([]);
    await jest.advanceTimersByTimeAsync(1);
    expect(sent).toEqual([{ value: 12, unit: 'cfm' }]);
    expect(saver.state).toEqual({ status: 'saved', at: 't1' });
  });

  it('keeps the answer through a dropped connection and sends it again until saved', async () => {
    const { saver, sent, states } = setUp([offline, offline, 'ok']);
    saver.change({ ok: true, answer: { text: 'Ask for the test pressure.' } });
    await jest.advanceTimersByTimeAsync(500);
    expect(saver.state.status).toBe('retrying');
    await jest.advanceTimersByTimeAsync(1000);
    expect(sent).toHaveLength(2);
    await jest.advanceTimersByTimeAsync(2000);
    expect(sent).toEqual(Array(3).fill({ text: 'Ask for the test pressure.' }));
    expect(saver.state.status).toBe('saved');
    expect(states.map((s) => s.status)).toEqual(['waiting', 'saving', 'retrying', 'saving', 'retrying', 'saving', 'saved']);
  });

  it('sends again at once when asked (back online), and a newer answer wins over the failed one', async () => {
    const { saver, sent } = setUp([offline]);
    saver.change({ ok: true, answer: { choiceId: 'a' } });
    await jest.advanceTimersByTimeAsync(500);
    saver.change({ ok: true, answer: { choiceId: 'b' } });
    await jest.advanceTimersByTimeAsync(500);
    expect(sent).toEqual([{ choiceId: 'a' }, { choiceId: 'b' }]);
    expect(saver.state.status).toBe('saved');

    const second = setUp([offline]);
    second.saver.change({ ok: true, answer: null });
    await jest.advanceTimersByTimeAsync(500);
    second.saver.retryNow();
    await jest.advanceTimersByTimeAsync(0);
    expect(second.sent).toEqual([null, null]);
    expect(second.saver.state.status).toBe('saved');
  });

  it('shows a refusal (400) and a local check without sending, and stops for good once the attempt is closed', async () => {
    const { saver, sent } = setUp([{ outcome: 'refused', message: 'Question "q1": not a unit of volume flow.' }, { outcome: 'closed', message: 'Submitted.' }]);
    saver.change({ ok: false, message: 'The answer must be a number.' });
    await jest.advanceTimersByTimeAsync(1000);
    expect(sent).toEqual([]);
    expect(saver.state).toEqual({ status: 'refused', message: 'The answer must be a number.' });

    saver.change({ ok: true, answer: { value: 3, unit: 'kPa' } });
    await jest.advanceTimersByTimeAsync(500);
    expect(saver.state).toEqual({ status: 'refused', message: 'Question "q1": not a unit of volume flow.' });

    saver.change({ ok: true, answer: { value: 3, unit: 'cfm' } });
    await jest.advanceTimersByTimeAsync(500);
    expect(saver.state.status).toBe('closed');
    saver.change({ ok: true, answer: { value: 4, unit: 'cfm' } });
    await jest.advanceTimersByTimeAsync(5000);
    expect(sent).toHaveLength(2);
  });

  it('flush sends what waits without the quiet time and waits for it', async () => {
    const { saver, sent } = setUp([]);
    saver.change({ ok: true, answer: { choiceIds: [] } });
    await expect(saver.flush()).resolves.toEqual({ status: 'saved', at: 't1' });
    expect(sent).toEqual([{ choiceIds: [] }]);
    await expect(saver.flush()).resolves.toEqual({ status: 'saved', at: 't1' });
    expect(sent).toHaveLength(1);
  });

  it('flush comes back while the connection is down rather than waiting for it', async () => {
    const { saver } = setUp([offline, offline, offline]);
    saver.change({ ok: true, answer: { text: 'x' } });
    await expect(saver.flush()).resolves.toMatchObject({ status: 'retrying' });
    saver.dispose();
  });
});
