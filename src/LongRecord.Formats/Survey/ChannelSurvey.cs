namespace LongRecord.Formats.Survey;

/// <summary>What a full pass over one channel found, as fractions of its samples.</summary>
/// <param name="Samples">Samples on the channel's elapsed-time axis.</param>
/// <param name="FlatPercent">Percentage of samples inside flat-line runs (see <see cref="SignalSurvey.FlatRunS"/>).</param>
/// <param name="SaturatedPercent">Percentage of samples at the digital minimum or maximum.</param>
/// <param name="MissingPercent">Percentage of samples with no value (gaps, invalid-sample codes).</param>
public readonly record struct ChannelSurvey(long Samples, double FlatPercent, double SaturatedPercent, double MissingPercent);
