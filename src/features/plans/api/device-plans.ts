import { useSyncExternalStore } from 'react';
import type { Axle } from '@shared/schemas/enums';

// What a visitor's device keeps: the swaps picked for a plan not yet made (the tray), and the keys of
// plans made before signing in, which prove the plans are theirs when they do sign in.

export type TraySwap = { slug: string; title: string; axle: Axle };
export type PlanTray = { chassisId: number; chassisName: string; swaps: TraySwap[] };
export type DevicePlan = { id: string; deviceKey: string };

const TRAY = 'swapyard.planTray';
const KEYS = 'swapyard.devicePlans';
const listeners = new Set<() => void>();

function read<T>(key: string, fallback: T): T {
  try {
    const raw = localStorage.getItem(key);
    return raw ? (JSON.parse(raw) as T) : fallback;
  } catch {
    return fallback;
  }
}

function write(key: string, value: unknown) {
  if (value === null) localStorage.removeItem(key);
  else localStorage.setItem(key, JSON.stringify(value));
  cache.delete(key);
  listeners.forEach((l) => l());
}

// useSyncExternalStore needs the same object while nothing changed
const cache = new Map<string, unknown>();
function snapshot<T>(key: string, fallback: T): T {
  if (!cache.has(key)) cache.set(key, read(key, fallback));
  return cache.get(key) as T;
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  const onStorage = (e: StorageEvent) => {
    if (e.key === TRAY || e.key === KEYS) {
      cache.delete(e.key);
      listener();
    }
  };
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
  };
}

export const usePlanTray = () =>
  useSyncExternalStore(
    subscribe,
    () => snapshot<PlanTray | null>(TRAY, null),
    () => null,
  );

/** Adds a swap to the tray; a swap for another chassis starts a new tray (a plan is for one car). */
export function addToTray(chassis: { id: number; name: string }, swap: TraySwap) {
  const tray = read<PlanTray | null>(TRAY, null);
  const same = tray && tray.chassisId === chassis.id ? tray : { chassisId: chassis.id, chassisName: chassis.name, swaps: [] };
  if (!same.swaps.some((s) => s.slug === swap.slug)) same.swaps.push(swap);
  write(TRAY, same);
}

export function removeFromTray(slug: string) {
  const tray = read<PlanTray | null>(TRAY, null);
  if (!tray) return;
  const swaps = tray.swaps.filter((s) => s.slug !== slug);
  write(TRAY, swaps.length ? { ...tray, swaps } : null);
}

export const clearTray = () => write(TRAY, null);

export const devicePlans = () => read<DevicePlan[]>(KEYS, []);
export const deviceKeyOf = (id: string) => devicePlans().find((p) => p.id === id)?.deviceKey;

export function rememberDevicePlan(plan: DevicePlan) {
  write(KEYS, [...devicePlans().filter((p) => p.id !== plan.id), plan]);
}

export function forgetDevicePlans(ids: string[]) {
  const left = devicePlans().filter((p) => !ids.includes(p.id));
  write(KEYS, left.length ? left : null);
}
