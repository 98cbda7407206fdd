namespace LongRecord.Analysis.Beats.Classification;

/// <summary>
/// Measurements of one beat made elsewhere (by delineation) that the classifier uses when they are known.
/// </summary>
/// <param name="QrsWidthMs">QRS width in milliseconds, or NaN when not measured.</param>
/// <param name="PWave">1 when a P wave was found before the QRS, 0 when looked for and not found, −1 when not judged.</param>
public readonly record struct BeatMeasurements(float QrsWidthMs, sbyte PWave)
{
    /// <summary>Nothing measured: the classifier relies on its own morphology features.</summary>
    public static BeatMeasurements Unknown { get; } = new(float.NaN, -1);
}
