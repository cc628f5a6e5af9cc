import { useId, useState } from 'react';
import { ROOM_PHOTO_MAX_BYTES, ROOM_PHOTO_MAX_COUNT, type RoomView } from '@shared/schemas/rooms';
import { Alert, Button } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';
import { useDeleteRoomPhoto } from '../api/delete-room-photo';
import { useUploadRoomPhoto } from '../api/upload-room-photo';

export function RoomPhotos({ room }: { room: RoomView }) {
  const fileId = useId();
  const captionId = useId();
  const upload = useUploadRoomPhoto(room.id);
  const remove = useDeleteRoomPhoto(room.id);
  const [caption, setCaption] = useState('');
  return (
    <div className="space-y-3">
      {room.photos.length === 0 ? <p className="text-ink-muted">No photos yet.</p> : null}
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        {room.photos.map((p) => (
          <li key={p.id} className="space-y-1">
            <a href={p.url} target="_blank" rel="noreferrer">
              <img src={p.thumbUrl} alt={p.caption || `Photo of ${room.name}`} width={p.width} height={p.height} className="aspect-[4/3] w-full rounded-lg object-cover" loading="lazy" />
            </a>
            {p.caption ? <p className="text-sm">{p.caption}</p> : null}
            {room.mine ? (
              <Button variant="ghost" size="sm" busy={remove.isPending && remove.variables === p.id} onClick={() => remove.mutate(p.id)}>
                Delete photo
              </Button>
            ) : null}
          </li>
        ))}
      </ul>
      {room.mine && room.photos.length < ROOM_PHOTO_MAX_COUNT ? (
        <form
          className="grid gap-3 sm:grid-cols-[2fr_2fr_auto] sm:items-end"
          onSubmit={(ev) => {
            ev.preventDefault();
            const file = (ev.currentTarget.elements.namedItem('file') as HTMLInputElement).files?.[0];
            if (file) upload.mutate({ file, caption }, { onSuccess: () => setCaption('') });
          }}
        >
          <div className="space-y-1">
            <label htmlFor={fileId} className="block font-medium">
              Add a photo (JPEG, PNG or WebP, up to {Math.round(ROOM_PHOTO_MAX_BYTES / 1024 / 1024)} MB)
            </label>
            <input id={fileId} name="file" type="file" accept="image/jpeg,image/png,image/webp" className="block w-full text-sm" required />
          </div>
          <div className="space-y-1">
            <label htmlFor={captionId} className="block font-medium">
              Caption
            </label>
            <input id={captionId} className={fieldClasses(false)} value={caption} onChange={(e) => setCaption(e.target.value)} maxLength={200} />
          </div>
          <Button type="submit" size="sm" busy={upload.isPending} busyLabel="Uploading">
            Upload
          </Button>
          {upload.error ? (
            <Alert tone="error" className="sm:col-span-3">
              {upload.error.message}
            </Alert>
          ) : null}
        </form>
      ) : null}
    </div>
  );
}
