using System.Collections.Concurrent;

namespace LongRecord.Analysis.Beats;

/// <summary>
/// Runs a <see cref="BeatFinisher"/> off the caller's thread, so that one recording's delineation and classification
/// overlap its conditioning, quality and detection. The two halves run on threads of their own, one after the other
/// like an assembly line: delineation alone costs about as much as the caller's three stages together, and with three
/// busy threads the operating system shares two cores among them instead of one thread waiting on the slowest.
/// Beats are handed over in batches (one hand-over per few dozen beats, not per beat) with a copy of their windows,
/// which travel with the batch from the delineation thread to the classification thread; each half sees the beats in
/// the same order as when run inline, so the beats are identical. Bounded queues keep memory fixed when a thread
/// falls behind.
/// </summary>
internal sealed class BeatFinishingThread : IDisposable
{
    private const int BatchBeats = 32;
    private const int QueuedBatches = 8;

    private readonly BeatFinisher _finisher;
    private readonly int _windowSamples;
    private readonly BlockingCollection<Batch> _toDelineate = new(QueuedBatches);
    private readonly BlockingCollection<Batch> _toClassify = new(QueuedBatches);
    private readonly ConcurrentBag<Batch> _free = new();
    private readonly ConcurrentQueue<Beat> _done = new();
    private readonly CancellationTokenSource _failed = new();
    private readonly Thread _delineation;
    private readonly Thread _classification;
    private readonly Action<Beat> _emit;
    private Batch? _filling;
    private volatile Exception? _failure;
    private bool _completed;

    public BeatFinishingThread(BeatFinisher finisher, int windowSamples)
    {
        _finisher = finisher;
        _windowSamples = windowSamples;
        _emit = _done.Enqueue;
        _delineation = new Thread(RunDelineation) { IsBackground = true, Name = "beats: delineation" };
        _classification = new Thread(RunClassification) { IsBackground = true, Name = "beats: classification" };
        _delineation.Start();
        _classification.Start();
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

    /// <summary>Moves the beats the threads have finished so far into <paramref name="into"/>.</summary>
    public void TakeDone(Queue<Beat> into)
    {
        ThrowIfFailed();
        while (_done.TryDequeue(out var beat))
        {
            into.Enqueue(beat);
        }
    }

    /// <summary>Hands over what is left, waits for the threads to finish every beat, and takes them all.</summary>
    public void Complete(Queue<Beat> into)
    {
        if (!_completed)
        {
            HandOver();
            _toDelineate.CompleteAdding();
            _delineation.Join();
            _classification.Join();
            _completed = true;
        }

        TakeDone(into);
    }

    /// <summary>Waits up to <paramref name="timeout"/> for both threads to end (for tests).</summary>
    internal bool WaitEnded(TimeSpan timeout) => _delineation.Join(timeout) && _classification.Join(timeout);

    public void Dispose()
    {
        if (!_toDelineate.IsAddingCompleted)
        {
            _toDelineate.CompleteAdding();
        }
    }

    private void HandOver()
    {
        if (_filling is { Count: > 0 } batch)
        {
            ThrowIfFailed();
            try
            {
                _toDelineate.Add(batch, _failed.Token);
            }
            catch (OperationCanceledException)
            {
                ThrowIfFailed();
                throw;
            }

            _filling = null;
        }
    }

    private void ThrowIfFailed()
    {
        if (_failure is Exception e)
        {
            throw new InvalidOperationException("the beats stage's delineation or classification thread failed: " + e.Message, e);
        }
    }

    private void RunDelineation()
    {
        try
        {
            foreach (var batch in _toDelineate.GetConsumingEnumerable(_failed.Token))
            {
                for (var i = 0; i < batch.Count; i++)
                {
                    batch.Kept[i] = _finisher.TryDelineate(batch.Jobs[i], batch.Window(i), out batch.Beats[i], out batch.R[i]);
                }

                _toClassify.Add(batch, _failed.Token);
            }
        }
        catch (Exception e)
        {
            Fail(e);
        }
        finally
        {
            _toClassify.CompleteAdding();
        }
    }

    private void RunClassification()
    {
        try
        {
            foreach (var batch in _toClassify.GetConsumingEnumerable(_failed.Token))
            {
                for (var i = 0; i < batch.Count; i++)
                {
                    if (batch.Kept[i])
                    {
                        _finisher.Classify(batch.Beats[i], batch.R[i], batch.Jobs[i], batch.Window(i), _emit);
                    }
                }

                batch.Count = 0;
                _free.Add(batch);
            }

            if (_failure is null)
            {
                _finisher.Flush(_emit);
            }
        }
        catch (Exception e)
        {
            Fail(e);
        }
    }

    // The first failure is kept; the other threads stop at their next wait, and a waiting producer sees it.
    private void Fail(Exception e)
    {
        if (e is OperationCanceledException && _failure is not null)
        {
            return;
        }

        Interlocked.CompareExchange(ref _failure, e, null);
        _failed.Cancel();
    }

    private sealed class Batch(int beats, int windowSamples)
    {
        private readonly float[] _windows = new float[beats * windowSamples];

        public readonly BeatJob[] Jobs = new BeatJob[beats];
        public readonly Beat[] Beats = new Beat[beats];
        public readonly int[] R = new int[beats];
        public readonly bool[] Kept = new bool[beats];
        public int Count;

        public Span<float> Window(int i) => _windows.AsSpan(i * windowSamples, windowSamples);
    }
}
