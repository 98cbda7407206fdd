namespace LongRecord.Formats.Survey;

/// <summary>
/// One streaming pass over a recording counting flat-line, saturated and missing samples per channel — properties of the
/// stored data that <c>inspect</c> shows before any analysis. Memory is one block per channel group.
/// </summary>
public static class SignalSurvey
{
    /// <summary>
    /// A run of identical consecutive values this long or longer counts as flat line (0.5 s; common practice, no source:
    /// a real ECG never holds one quantisation level for half a second).
    /// </summary>
    public const double FlatRunS = 0.5;

    private const int BlockSamples = 1 << 16;

    public static ChannelSurvey[] Run(IRecordingReader reader, CancellationToken cancellation = default)
    {
        var channels = reader.Info.Channels;
        var result = new ChannelSurvey[channels.Count];
        if (!reader.Info.HasSignal)
        {
            return result;
        }

        // Group channels of one rate so interleaved formats decode each byte once.
        foreach (var group in channels.Select((c, i) => (c, i)).GroupBy(x => (x.c.SamplingRateHz, x.c.SampleCount)))
        {
            var indices = group.Select(x => x.i).ToArray();
            var counters = indices.Select(i => new Counter(channels[i])).ToArray();
            var n = group.Key.SampleCount;
            var buffer = new float[indices.Length * BlockSamples];
            for (long start = 0; start < n; start += BlockSamples)
            {
                cancellation.ThrowIfCancellationRequested();
                var count = (int)Math.Min(BlockSamples, n - start);
                reader.Read(indices, start, count, buffer);
                for (var k = 0; k < indices.Length; k++)
                {
                    counters[k].Push(buffer.AsSpan(k * count, count));
                }
            }

            for (var k = 0; k < indices.Length; k++)
            {
                result[indices[k]] = counters[k].Finish();
            }
        }

        return result;
    }

    private sealed class Counter
    {
        private readonly float _low;
        private readonly float _high;
        private readonly long _minRun;
        private long _samples;
        private long _flat;
        private long _saturated;
        private long _missing;
        private float _runValue = float.NaN;
        private long _runLength;

        public Counter(ChannelInfo channel)
        {
            var scale = channel.IsVoltage ? channel.MillivoltsPerUnit : 1.0;
            var a = (channel.DigitalMin - channel.Baseline) / channel.Gain * scale;
            var b = (channel.DigitalMax - channel.Baseline) / channel.Gain * scale;
            var halfStep = 0.5 * channel.Resolution;
            _low = (float)(Math.Min(a, b) + halfStep);
            _high = (float)(Math.Max(a, b) - halfStep);
            _minRun = Math.Max(2, (long)Math.Ceiling(FlatRunS * channel.SamplingRateHz));
        }

        public void Push(ReadOnlySpan<float> x)
        {
            _samples += x.Length;
            foreach (var v in x)
            {
                if (float.IsNaN(v))
                {
                    _missing++;
                    CloseRun();
                    continue;
                }

                if (v <= _low || v >= _high)
                {
                    _saturated++;
                }

                if (v == _runValue)
                {
                    _runLength++;
                }
                else
                {
                    CloseRun();
                    _runValue = v;
                    _runLength = 1;
                }
            }
        }

        public ChannelSurvey Finish()
        {
            CloseRun();
            double Pct(long k) => _samples == 0 ? 0 : 100.0 * k / _samples;
            return new ChannelSurvey(_samples, Pct(_flat), Pct(_saturated), Pct(_missing));
        }

        private void CloseRun()
        {
            if (_runLength >= _minRun)
            {
                _flat += _runLength;
            }

            _runLength = 0;
            _runValue = float.NaN;
        }
    }
}
