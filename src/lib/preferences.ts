import { create } from 'zustand';
import { persist } from 'zustand/middleware';

/** Text size steps for tired eyes; the root font size scales everything drawn in rem. */
export const TEXT_SIZES = { standard: '100%', large: '118.75%', largest: '137.5%' } as const;
export type TextSize = keyof typeof TEXT_SIZES;

interface Preferences {
  textSize: TextSize;
  setTextSize: (size: TextSize) => void;
}

export const usePreferences = create<Preferences>()(
  persist((set) => ({ textSize: 'standard', setTextSize: (textSize) => set({ textSize }) }), { name: 'rackside.preferences' }),
);
