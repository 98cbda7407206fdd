using LongRecord.Analysis.Quality;
using LongRecord.Formats;

namespace LongRecord.Pipeline.Channels;

/// <summary>The physical values, in mV, of each chosen channel's digital limits: where a saturated lead sits.</summary>
public static class SaturationRails
{
    public static QualitySettings For(RecordingInfo info, EcgChannels channels)
    {
        var low = new double[channels.Indices.Length];
        var high = new double[channels.Indices.Length];
        for (var k = 0; k < channels.Indices.Length; k++)
        {
            var c = info.Channels[channels.Indices[k]];
            var a = (c.DigitalMin - c.Baseline) / c.Gain * c.MillivoltsPerUnit;
            var b = (c.DigitalMax - c.Baseline) / c.Gain * c.MillivoltsPerUnit;
            // A range far beyond any ECG (formats without digital limits) says nothing about saturation.
            var known = double.IsFinite(a) && double.IsFinite(b) && Math.Max(Math.Abs(a), Math.Abs(b)) < 1000;
            low[k] = known ? Math.Min(a, b) : double.NaN;
            high[k] = known ? Math.Max(a, b) : double.NaN;
        }

        return new QualitySettings { RailLowMv = low, RailHighMv = high };
    }
}
