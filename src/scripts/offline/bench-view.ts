// The bench view: the fix's cautions, then its remedy one step at a time in large text, moved with big buttons or the
// keyboard (arrows, Page Up/Down, space; Escape closes), keeping the screen awake while open where the browser can.

interface WakeLockHolder {
  release(): Promise<void>;
}
type WakeLockNavigator = Navigator & { wakeLock?: { request(type: 'screen'): Promise<WakeLockHolder> } };

/** The steps: every caution box, then each list item of the remedy, or each of its blocks when it has no list. */
function collectSteps(): HTMLElement[] {
  const steps: HTMLElement[] = [];
  for (const caution of document.querySelectorAll<HTMLElement>('#cautions .caution, #cautions [id^="caution-"]')) {
    if (!steps.some((s) => s.contains(caution) || caution.contains(s))) steps.push(caution);
  }
  const remedy = document.querySelector<HTMLElement>('#remedy-section .prose-fix');
  for (const block of remedy ? Array.from(remedy.children) : []) {
    if (block instanceof HTMLOListElement || block instanceof HTMLUListElement)
      steps.push(...(Array.from(block.children) as HTMLElement[]));
    else steps.push(block as HTMLElement);
  }
  return steps;
}

export function openBenchView(): void {
  const steps = collectSteps();
  if (steps.length === 0) return;
  const opener = document.activeElement as HTMLElement | null;
  const dialog = document.createElement('dialog');
  dialog.className = 'bench-view';
  dialog.setAttribute('aria-label', 'Bench view: the remedy step by step');
  dialog.innerHTML = `<div class="bench-view__bar"><p class="bench-view__count" aria-live="polite"></p><p class="bench-view__awake"></p>
    <button type="button" class="btn btn-quiet" data-close>Close</button></div><div class="bench-view__step"></div>
    <div class="bench-view__nav"><button type="button" class="btn btn-quiet" data-back>Back</button><button type="button" class="btn" data-next>Next step</button></div>`;
  const count = dialog.querySelector<HTMLElement>('.bench-view__count')!;
  const awake = dialog.querySelector<HTMLElement>('.bench-view__awake')!;
  const stage = dialog.querySelector<HTMLElement>('.bench-view__step')!;
  const back = dialog.querySelector<HTMLButtonElement>('[data-back]')!;
  const next = dialog.querySelector<HTMLButtonElement>('[data-next]')!;
  let index = 0;
  let lock: WakeLockHolder | null = null;

  const show = (to: number): void => {
    index = Math.max(0, Math.min(steps.length - 1, to));
    const step = steps[index]!.cloneNode(true) as HTMLElement;
    step.removeAttribute('id');
    for (const withId of step.querySelectorAll('[id]')) withId.removeAttribute('id');
    stage.replaceChildren(step);
    count.textContent = `Step ${index + 1} of ${steps.length}`;
    back.disabled = index === 0;
    next.textContent = index === steps.length - 1 ? 'Done' : 'Next step';
  };
  const keepAwake = async (): Promise<void> => {
    const wakeLock = (navigator as WakeLockNavigator).wakeLock;
    if (!wakeLock) {
      awake.textContent = 'This browser cannot keep the screen on.';
      return;
    }
    try {
      lock = await wakeLock.request('screen');
      awake.textContent = 'The screen stays on while this is open.';
    } catch {
      awake.textContent = 'The screen could not be kept on (battery saver?).';
    }
  };
  const onVisible = (): void => {
    if (document.visibilityState === 'visible' && dialog.open) void keepAwake();
  };
  const close = (): void => {
    dialog.close();
  };

  back.addEventListener('click', () => show(index - 1));
  next.addEventListener('click', () => (index === steps.length - 1 ? close() : show(index + 1)));
  dialog.querySelector('[data-close]')!.addEventListener('click', close);
  dialog.addEventListener('keydown', (event) => {
    if (event.target instanceof HTMLButtonElement && (event.key === ' ' || event.key === 'Enter')) return;
    if (['ArrowRight', 'ArrowDown', 'PageDown', ' '].includes(event.key)) show(index + 1);
    else if (['ArrowLeft', 'ArrowUp', 'PageUp'].includes(event.key)) show(index - 1);
    else return;
    event.preventDefault();
  });
  dialog.addEventListener('close', () => {
    void lock?.release();
    document.removeEventListener('visibilitychange', onVisible);
    dialog.remove();
    opener?.focus();
  });
  document.addEventListener('visibilitychange', onVisible);
  document.body.append(dialog);
  show(0);
  dialog.showModal();
  next.focus();
  void keepAwake();
}
