namespace LongRecord.Analysis.Beats;

/// <summary>The stretch of signal around a beat that delineation and classification look at.</summary>
public static class BeatWindow
{
    /// <summary>Seconds before the detector's fiducial point: room for the P wave and the PR segment.</summary>
    public const double PreS = 0.5;

    /// <summary>Seconds after the fiducial point: room for the T wave at slow rates.</summary>
    public const double PostS = 0.7;

    /// <summary>Seconds of conditioned signal kept: the window plus the detector's longest decision delay (search-back).</summary>
    public const double RingS = 12;
}
