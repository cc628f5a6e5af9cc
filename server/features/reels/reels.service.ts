import { randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { rm } from 'node:fs/promises';
import { Readable } from 'node:stream';
import type { Db } from '../../db/client';
import type { Storage } from '../../storage/storage';
import type { Logger } from '../../logger';
import { assertCan, assertVerified, type CurrentUser } from '../../auth/middleware';
import { AppError, conflict, notFound } from '../../http/app-error';
import { isWavError } from '../../audio/wav-errors';
import type { ReelTrackSummary } from '@shared/schemas/profiles';
import { REEL_MAX_TRACKS, type ReelOrderInput, type ReelTrackFieldsInput } from '@shared/schemas/reels';
import type { WaveformPeaks } from '@shared/schemas/delivery-check';
import { toReelTrackSummary, type ReelTrackRow, type ReelsRepository } from './reels.repository';
import type { ProfilesRepository } from '../profiles/profiles.repository';
import { isDrummerListed } from '../profiles/profiles.service';
import { mp3Peaks, Mp3DecodeError } from '../../audio/mp3-peaks';
import { computeWavPeaks, fitPeaks } from './reel-peaks';

/** An audio file already on local disk (multer's temp file, or one the seed wrote); the service owns it now. */
export type IncomingAudio = { tmpPath: string; kind: 'wav' | 'mp3'; mime: string; size: number };

export function createReelsService(deps: { db: Db; storage: Storage; repo: ReelsRepository; profiles: ProfilesRepository; logger: Logger }) {
  const { db, storage, repo, profiles, logger } = deps;

  /** A reel is as public as its profile: listed profiles to everyone, the rest to the owner (and admins). */
  function assertCanHear(viewer: CurrentUser | null, row: ReelTrackRow | undefined): asserts row is ReelTrackRow {
    if (!row) throw notFound('That reel track');
    if (viewer && (viewer.id === row.drummerId || viewer.roles.includes('admin'))) return;
    const owner = profiles.findOwner(row.drummerId);
    const profile = profiles.findDrummer(row.drummerId);
    if (!owner || owner.disabledAt || !profile || !isDrummerListed(profile)) throw notFound('That reel track');
  }

  async function peaksOf(file: IncomingAudio): Promise<WaveformPeaks> {
    try {
      return file.kind === 'wav' ? await computeWavPeaks(file.tmpPath) : fitPeaks(await mp3Peaks(file.tmpPath));
    } catch (error) {
      if (!isWavError(error) && !(error instanceof Mp3DecodeError)) throw error;
      throw new AppError('unreadable_audio', `That ${file.kind.toUpperCase()} file cannot be read: ${error.message}`, 422, { file: 'Export the track again as WAV or MP3' });
    }
  }

  async function removeStored(keys: (string | null)[]): Promise<void> {
    for (const key of keys) {
      if (!key) continue;
      await storage.delete(key).catch((error: unknown) => logger.error(`could not delete ${key}`, error));
    }
  }

  return {
    assertMayUpload(user: CurrentUser): void {
      assertCan(user, 'update:drummer-profile:own', 'Only drummers have a reel');
      assertVerified(user);
      if (repo.countByDrummer(user.id) >= REEL_MAX_TRACKS) {
        throw conflict('reel_full', `A reel holds at most ${REEL_MAX_TRACKS} tracks. Delete one first.`);
      }
    },

    async addTrack(user: CurrentUser, file: IncomingAudio, fields: ReelTrackFieldsInput): Promise<ReelTrackSummary> {
      const id = randomUUID();
      const audioKey = `reels/${id}.${file.kind}`;
      const peaksKey = `reels/${id}.peaks.json`;
      let stored: string[] = [];
      try {
        this.assertMayUpload(user);
        const peaks = await peaksOf(file);
        if (peaks) {
          await storage.put(peaksKey, Readable.from([JSON.stringify(peaks)]));
          stored.push(peaksKey);
        }
        await storage.put(audioKey, createReadStream(file.tmpPath));
        stored.push(audioKey);
        const row: ReelTrackRow = {
          id,
          drummerId: user.id,
          title: fields.title,
          style: fields.style ?? '',
          tempoBpm: fields.tempo ?? null,
          audioKey,
          peaksKey: peaks ? peaksKey : null,
          mime: file.mime,
          sizeBytes: file.size,
          durationSec: peaks ? Math.round(peaks.durationSec * 1000) / 1000 : null,
          position: 0,
          createdAt: new Date(),
        };
        db.transaction((tx) => {
          // Checked again inside the write: two uploads at once must not both take the last place.
          if (repo.countByDrummer(user.id, tx) >= REEL_MAX_TRACKS) throw conflict('reel_full', `A reel holds at most ${REEL_MAX_TRACKS} tracks.`);
          repo.insert({ ...row, position: repo.nextPosition(user.id, tx) }, tx);
        });
        stored = [];
        return toReelTrackSummary(repo.findById(id)!);
      } finally {
        await rm(file.tmpPath, { force: true });
        await removeStored(stored);
      }
    },

    async deleteTrack(user: CurrentUser, id: string): Promise<void> {
      const row = repo.findById(id);
      // Someone else's track answers like a missing one: ids are not confirmed to strangers.
      if (!row || row.drummerId !== user.id) throw notFound('That reel track');
      repo.delete(id, user.id);
      await removeStored([row.audioKey, row.peaksKey]);
    },

    reorder(user: CurrentUser, input: ReelOrderInput): ReelTrackSummary[] {
      assertCan(user, 'update:drummer-profile:own', 'Only drummers have a reel');
      db.transaction((tx) => {
        const current = repo.listByDrummer(user.id, tx).map((t) => t.id);
        const same = input.ids.length === current.length && new Set(input.ids).size === current.length && repo.idsOf(user.id, input.ids, tx).length === current.length;
        if (!same) throw new AppError('order_mismatch', 'Send every track of your reel exactly once, in the new order', 400, { ids: 'Must list each of your tracks once' });
        repo.setPositions(user.id, input.ids, tx);
      });
      return repo.listByDrummer(user.id).map(toReelTrackSummary);
    },

    async openAudio(viewer: CurrentUser | null, id: string): Promise<{ track: ReelTrackRow; size: number }> {
      const track = repo.findById(id);
      assertCanHear(viewer, track);
      const stat = await storage.stat(track.audioKey);
      if (!stat) throw notFound('That reel track');
      return { track, size: stat.size };
    },

    openPeaks(viewer: CurrentUser | null, id: string): Readable {
      const track = repo.findById(id);
      assertCanHear(viewer, track);
      if (!track.peaksKey) throw new AppError('no_peaks', 'This track has no waveform (MP3 tracks play without one for now)', 404);
      return storage.get(track.peaksKey);
    },

    audioStream(track: ReelTrackRow, range?: { start: number; end: number }): Readable {
      return storage.get(track.audioKey, range);
    },
  };
}
export type ReelsService = ReturnType<typeof createReelsService>;
