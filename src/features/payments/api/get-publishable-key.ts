import { api } from '@/lib/api-client';

/** The processor's publishable key when a real one is configured; null on the local fake. */
export async function getPublishableKey(): Promise<string | null> {
  const config = await api.get<{ stripePublishableKey?: unknown }>('/api/config');
  const key = config?.stripePublishableKey;
  return typeof key === 'string' && key.startsWith('pk_') ? key : null;
}
