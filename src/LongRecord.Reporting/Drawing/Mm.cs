namespace LongRecord.Reporting.Drawing;

/// <summary>Page geometry: pages are drawn in millimetres; the PDF's unit is the point (1/72 in).</summary>
public static class Mm
{
    /// <summary>Points per millimetre: 72 / 25.4.</summary>
    public const float Points = 72f / 25.4f;

    /// <summary>A font size given in points, as millimetres on the page.</summary>
    public static float FromPoints(float points) => points / Points;
}
