using LongRecord.Analysis.Rhythm;

namespace LongRecord.Analysis.Episodes;

/// <summary>Where a candidate came from.</summary>
[Flags]
internal enum CandidateSource
{
    None = 0,

    /// <summary>A run of beats above the tachycardia rate.</summary>
    Fast = 1,

    /// <summary>Consecutive S-class beats.</summary>
    SveRun = 2,

    /// <summary>Consecutive V-class beats.</summary>
    VeRun = 4,

    /// <summary>An AF or af-brief episode of the rhythm stage.</summary>
    RhythmAf = 8,
}

/// <summary>A stretch of beats that may be a tachycardia, an ectopic run or AF, before classification.</summary>
internal sealed class Candidate
{
    public Candidate(int first, int last, CandidateSource source)
    {
        First = first;
        Last = last;
        Source = source;
    }

    /// <summary>First beat (index into the beat track).</summary>
    public int First { get; set; }

    /// <summary>Last beat.</summary>
    public int Last { get; set; }

    public CandidateSource Source { get; set; }

    /// <summary>The rhythm stage's AF episodes inside it.</summary>
    public List<RhythmEpisode> AfPieces { get; } = [];

    public int BeatCount => Last - First + 1;

    public bool Overlaps(Candidate other) => First <= other.Last && other.First <= Last;

    public void Absorb(Candidate other)
    {
        First = Math.Min(First, other.First);
        Last = Math.Max(Last, other.Last);
        Source |= other.Source;
        AfPieces.AddRange(other.AfPieces);
    }
}
