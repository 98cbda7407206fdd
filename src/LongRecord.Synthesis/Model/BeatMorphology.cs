namespace LongRecord.Synthesis.Model;

/// <summary>A QRS–T shape: the Q, R and S components keep their timing at every rate; the T components scale with RR.</summary>
internal sealed record BeatMorphology(string Name, bool IsBroad, IReadOnlyList<GaussianWave> Qrs, IReadOnlyList<GaussianWave> T);

/// <summary>A P wave shape: one or two Gaussian components around the P peak.</summary>
internal sealed record PWaveShape(string Name, IReadOnlyList<GaussianWave> Components);
