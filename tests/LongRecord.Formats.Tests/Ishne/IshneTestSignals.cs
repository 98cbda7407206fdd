using LongRecord.Formats.Ishne;

namespace LongRecord.Formats.Tests.Ishne;

/// <summary>Writer options and deterministic test signals for a small invented recording (Brackenfield clinic scenario).</summary>
internal static class IshneTestSignals
{
    public static IshneWriterOptions TwoLeadOptions(short rateHz = 200) => new()
    {
        Leads =
        [
            new IshneLead(IshneLeadCode.II, 2500, IshneLeadQuality.Good),
            new IshneLead(IshneLeadCode.V5, 5000, IshneLeadQuality.IntermittentNoise),
        ],
        SamplingRateHz = rateHz,
        FirstName = "Tobiah",
        LastName = "Quillfeather",
        SubjectId = "NW-2026-0031",
        Sex = IshneSex.Male,
        Race = 0,
        BirthDate = new DateOnly(1958, 11, 2),
        RecordingDate = new DateOnly(2026, 3, 4),
        StartTime = new TimeOnly(8, 15, 30),
        FileDate = new DateOnly(2026, 3, 6),
        Pacemaker = 0,
        RecorderType = "digital",
        Proprietary = "Brackenfield Cardiology Clinic",
        Copyright = "invented demo data",
        VariableBlockText = "arrived 08:05\nexercise 10:20-10:50",
    };

    /// <summary>Channel-major millivolts: lead k's n samples at k × n. A sine plus noise, amplitude about ±2 mV.</summary>
    public static float[] Millivolts(int leadCount, int n, int seed = 11)
    {
        var random = new Random(seed);
        var values = new float[leadCount * n];
        for (var k = 0; k < leadCount; k++)
        {
            for (var i = 0; i < n; i++)
            {
                values[k * n + i] = (float)(1.5 * Math.Sin(2 * Math.PI * i / (97.0 + k)) + 0.4 * (random.NextDouble() - 0.5));
            }
        }

        return values;
    }
}
