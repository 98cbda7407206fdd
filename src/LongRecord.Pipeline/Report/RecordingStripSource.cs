using LongRecord.Analysis.Beats;
using LongRecord.Analysis.Conditioning;
using LongRecord.Formats;
using LongRecord.Reporting.Model;

namespace LongRecord.Pipeline.Report;

/// <summary>
/// Strip windows read from the recording one at a time through the Formats readers (memory: one window), conditioned
/// for display with the analysis' own conditioner (0.5 Hz high-pass and mains notches) run over a few seconds of
/// lead-in, and labelled with the analysis' beats.
/// </summary>
public sealed class RecordingStripSource : IStripSource, IDisposable
{
    /// <summary>At most this many leads on a strip (the first analysed ones), so a 12-lead file stays readable.</summary>
    public const int MaxLeads = 3;

    // Lead-in run through the conditioner before the window so its high-pass has settled (its time constant is about
    // 0.3 s at 0.5 Hz; 3 s leaves under 0.01 % of a step: arithmetic).
    private const double LeadInS = 3;

    private readonly IRecordingReader _reader;
    private readonly int[] _channels;
    private readonly double _rateHz;
    private readonly long _sampleCount;
    private readonly IReadOnlyList<Beat> _beats;
    private readonly StripSignal _signal;
    private float[] _buffer = [];

    public RecordingStripSource(IRecordingReader reader, IReadOnlyList<int> channels, double rateHz, IReadOnlyList<string> labels, IReadOnlyList<Beat> beats)
    {
        _reader = reader;
        _channels = channels.Take(MaxLeads).ToArray();
        _rateHz = rateHz;
        _sampleCount = _channels.Length == 0 ? 0 : _channels.Min(c => reader.Info.Channels[c].SampleCount);
        _beats = beats;
        LeadLabels = labels.Take(_channels.Length).ToArray();
        _signal = new StripSignal(_channels.Length, (int)Math.Ceiling(10 * rateHz));
    }

    public IReadOnlyList<string> LeadLabels { get; }

    public StripSignal Read(double startS, double durationS)
    {
        var start = Math.Clamp((long)Math.Round(startS * _rateHz), 0, _sampleCount);
        var count = (int)Math.Clamp((long)Math.Round(durationS * _rateHz), 0, _sampleCount - start);
        var lead = (int)Math.Min(start, (long)(LeadInS * _rateHz));
        var total = lead + count;
        _signal.Reset(start / _rateHz, _rateHz, count);
        if (count == 0 || _channels.Length == 0)
        {
            return _signal;
        }

        if (_buffer.Length < _channels.Length * total)
        {
            _buffer = new float[_channels.Length * total];
        }

        var block = _buffer.AsSpan(0, _channels.Length * total);
        _reader.Read(_channels, start - lead, total, block);
        for (var k = 0; k < _channels.Length; k++)
        {
            var samples = block.Slice(k * total, total);
            new EcgConditioner(_rateHz).Process(samples);
            samples[lead..].CopyTo(_signal.Samples.AsSpan(k * count, count));
        }

        AddBeats(start, start + count);
        return _signal;
    }

    public void Dispose() => _reader.Dispose();

    private void AddBeats(long from, long to)
    {
        var lo = BeatSearch.FirstAtOrAfter(_beats, from);
        for (var i = lo; i < _beats.Count && _beats[i].Sample < to; i++)
        {
            _signal.Beats.Add(new StripBeat(_beats[i].Sample / _rateHz, _beats[i].Class.ToString()[0]));
        }
    }
}
