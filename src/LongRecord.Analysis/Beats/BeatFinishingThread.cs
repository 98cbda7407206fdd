using System.Collections.Concurrent;

namespace LongRecord.Analysis.Beats;

/// <summary>
/// Runs a <see cref="BeatFinisher"/> on a thread of its own, so that one recording's delineation and classification
/// overlap its conditioning, quality and detection on a second core. Beats are handed over in batches (one hand-over
/// per few dozen beats, not per beat) with a copy of their windows; the finisher sees them in the same order as when
/// run inline, so the beats are identical. A bounded queue keeps memory fixed when the thread falls behind.
/// </summary>
internal sealed class BeatFinishingThread : IDisposable
{
    private const int BatchBeats = 32;
    private const int QueuedBatches = 8;

    private readonly BeatFinisher _finisher;
    private readonly int _windowSamples;
    private readonly BlockingCollection<Batch> _full = new(QueuedBatches);
    private readonly ConcurrentBag<Batch> _free = new();
    private readonly ConcurrentQueue<Beat> _done = new();
    private readonly Thread _thread;
    private readonly Action<Beat> _emit;
    private Batch? _filling;
    private volatile Exception? _failure;
    private bool _completed;

    public BeatFinishingThread(BeatFinisher finisher, int windowSamples)
    {
        _finisher = finisher;
        _windowSamples = windowSamples;
        _emit = _done.Enqueue;
        _thread = new Thread(Run) { IsBackground = true, Name = "beats: delineation and classification" };
        _thread.Start();
    }

    /// <summary>The window buffer of the next beat: fill it, then call <see cref="Submit"/>.</summary>
    public Span<float> NextWindow()
    {
        _filling ??= _free.TryTake(out var b) ? b : new Batch(BatchBeats, _windowSamples);
        return _filling.Window(_filling.Count);
    }

    /// <summary>Hands over the beat whose window <see cref="NextWindow"/> gave.</summary>
    public void Submit(in BeatJob job)
    {
        var batch = _filling ?? throw new InvalidOperationException("NextWindow was not called");
        batch.Jobs[batch.Count++] = job;
        if (batch.Count == BatchBeats)
        {
            HandOver();
        }
    }

    /// <summary>Moves the beats the thread has finished so far into <paramref name="into"/>.</summary>
    public void TakeDone(Queue<Beat> into)
    {
        ThrowIfFailed();
        while (_done.TryDequeue(out var beat))
        {
            into.Enqueue(beat);
        }
    }

    /// <summary>Hands over what is left, waits for the thread to finish every beat, and takes them all.</summary>
    public void Complete(Queue<Beat> into)
    {
        if (!_completed)
        {
            HandOver();
            _full.CompleteAdding();
            _thread.Join();
            _completed = true;
        }

        TakeDone(into);
    }

    /// <summary>Waits up to <paramref name="timeout"/> for the thread to end (for tests).</summary>
    internal bool WaitEnded(TimeSpan timeout) => _thread.Join(timeout);

    public void Dispose()
    {
        if (!_full.IsAddingCompleted)
        {
            _full.CompleteAdding();
        }
    }

    private void HandOver()
    {
        if (_filling is { Count: > 0 } batch)
        {
            ThrowIfFailed();
            _full.Add(batch);
            _filling = null;
        }
    }

    private void ThrowIfFailed()
    {
        if (_failure is Exception e)
        {
            throw new InvalidOperationException("the beats stage's delineation thread failed: " + e.Message, e);
        }
    }

    private void Run()
    {
        try
        {
            foreach (var batch in _full.GetConsumingEnumerable())
            {
                for (var i = 0; i < batch.Count; i++)
                {
                    _finisher.Finish(batch.Jobs[i], batch.Window(i), _emit);
                }

                batch.Count = 0;
                _free.Add(batch);
            }

            _finisher.Flush(_emit);
        }
        catch (Exception e)
        {
            _failure = e;

            // Let a waiting producer go on; it sees the failure at its next call.
            while (_full.TryTake(out _))
            {
            }
        }
    }

    private sealed class Batch(int beats, int windowSamples)
    {
        private readonly float[] _windows = new float[beats * windowSamples];

        public readonly BeatJob[] Jobs = new BeatJob[beats];
        public int Count;

        public Span<float> Window(int i) => _windows.AsSpan(i * windowSamples, windowSamples);
    }
}
