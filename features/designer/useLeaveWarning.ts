/** Native apps save on leaving the screen; only a browser tab can be closed under the designer. */
export function useLeaveWarning(_dirty: boolean): void {}
