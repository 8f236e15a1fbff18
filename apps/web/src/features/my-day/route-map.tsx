// The day's route on a Leaflet map: numbered stops in driving order joined by a line from the start point. Loaded
// only with My day (lazy), and without tiles (offline, or no tile server set) the stops still show on a plain ground.
import 'leaflet/dist/leaflet.css';
import { useState } from 'react';
import L from 'leaflet';
import { MapContainer, Marker, Polyline, TileLayer } from 'react-leaflet';
import type { RouteDay } from '@bumperline/contracts/route-days';

function numberIcon(n: number) {
  return L.divIcon({
    className: '',
    html: `<span style="display:flex;align-items:center;justify-content:center;width:32px;height:32px;border-radius:50%;background:#14213d;border:4px solid #d4a017;color:#fff;font:800 15px/1 system-ui;box-shadow:0 1px 3px rgba(0,0,0,.45)">${n}</span>`,
    iconSize: [32, 32],
    iconAnchor: [16, 16],
  });
}

export default function RouteMap({ day, tileUrl }: { day: RouteDay; tileUrl: string }) {
  const [tilesFailed, setTilesFailed] = useState(false);
  const stops = day.stops.map((s) => [s.venue.lat, s.venue.lng] as [number, number]);
  const start = day.technician.startPoint ? ([day.technician.startPoint.lat, day.technician.startPoint.lng] as [number, number]) : null;
  const line = start ? [start, ...stops, start] : stops;
  const all = start ? [start, ...stops] : stops;
  if (all.length === 0) return null;
  const bounds = L.latLngBounds(all).pad(0.15);
  const showTiles = !!tileUrl && !tilesFailed;
  return (
    <figure className="relative m-0" aria-label="Map of the day's stops in driving order">
      <MapContainer bounds={bounds} className="h-72 w-full rounded-lg" style={{ background: '#e8ecf3' }} scrollWheelZoom={false}>
        {showTiles && (
          <TileLayer
            url={tileUrl}
            attribution="Map tiles: your configured tile server"
            eventHandlers={{ tileerror: () => setTilesFailed(true) }}
          />
        )}
        <Polyline positions={line} pathOptions={{ color: '#14213d', weight: 4, opacity: 0.8 }} />
        {day.stops.map((s, i) => (
          // Pictures, not controls: the stops list above says the same in words, and close stops' markers would
          // otherwise be touch targets overlapping each other.
          <Marker key={s.venue.id} position={[s.venue.lat, s.venue.lng]} icon={numberIcon(i + 1)} interactive={false} keyboard={false} />
        ))}
      </MapContainer>
      {!showTiles && (
        <figcaption className="mt-1 text-sm text-ink-soft">
          {tilesFailed ? 'Map tiles could not be loaded (offline?).' : 'No map tile server is set.'} Stops are shown on a plain background.
        </figcaption>
      )}
    </figure>
  );
}
