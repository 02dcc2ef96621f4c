'use client';
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

const INK = '#1f2d24';
const BARS = ['#234a35', '#b7791f', '#4a6fa5', '#7a8b3a', '#8c4a3a', '#5b6b60'];

/** Honey per colony in one yard: simple bars with labelled axes (data already aggregated on the server). */
export function YardBars({
  yard,
  unit,
  data,
}: {
  yard: string;
  unit: string;
  data: { colony: string; honey: number }[];
}) {
  return (
    <figure className="card">
      <figcaption className="mb-2 font-heading text-lg">{yard}</figcaption>
      <div className="h-56 w-full" role="img" aria-label={`Honey per colony in ${yard}, in ${unit}`}>
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={data} margin={{ top: 8, right: 8, bottom: 24, left: 8 }}>
            <CartesianGrid strokeDasharray="3 3" vertical={false} />
            <XAxis
              dataKey="colony"
              tick={{ fontSize: 11, fill: INK }}
              label={{ value: 'Colony', position: 'insideBottom', offset: -16, fill: INK }}
            />
            <YAxis
              tick={{ fontSize: 11, fill: INK }}
              label={{ value: `Honey (${unit})`, angle: -90, position: 'insideLeft', fill: INK }}
            />
            <Tooltip formatter={(v) => [`${v} ${unit}`, 'Honey']} />
            <Bar dataKey="honey" fill={BARS[0]} isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}

/** Season over season: honey per yard, one group of bars per season. */
export function SeasonBars({
  unit,
  yards,
  data,
}: {
  unit: string;
  yards: string[];
  data: Record<string, number | string>[];
}) {
  return (
    <figure className="card">
      <figcaption className="mb-2 font-heading text-lg">Season over season</figcaption>
      <div className="h-64 w-full" role="img" aria-label={`Honey per yard per season, in ${unit}`}>
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={data} margin={{ top: 8, right: 8, bottom: 24, left: 8 }}>
            <CartesianGrid strokeDasharray="3 3" vertical={false} />
            <XAxis
              dataKey="season"
              tick={{ fontSize: 11, fill: INK }}
              label={{ value: 'Season', position: 'insideBottom', offset: -16, fill: INK }}
            />
            <YAxis
              tick={{ fontSize: 11, fill: INK }}
              label={{ value: `Honey (${unit})`, angle: -90, position: 'insideLeft', fill: INK }}
            />
            <Tooltip formatter={(v, name) => [`${v} ${unit}`, String(name)]} />
            <Legend verticalAlign="top" />
            {yards.map((y, i) => (
              <Bar key={y} dataKey={y} fill={BARS[i % BARS.length]} isAnimationActive={false} />
            ))}
          </BarChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
