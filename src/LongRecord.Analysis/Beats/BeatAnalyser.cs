using System.Diagnostics;
using LongRecord.Analysis.Beats.Classification;
using LongRecord.Analysis.Beats.Delineation;
using LongRecord.Analysis.Conditioning;
using LongRecord.Analysis.Quality;

namespace LongRecord.Analysis.Beats;

/// <summary>
/// The beats stage over a stream of blocks: conditions every lead, detects QRS complexes on all leads together,
/// delineates and classifies each beat from a window of the conditioned signal, and keeps the beats that fall in
/// analysable signal. Pure computation: the caller reads the file and hands over blocks (lead-major, mV).
/// Any block size gives the same beats.
/// </summary>
public sealed class BeatAnalyser : IDisposable
{
    private readonly double _fs;
    private readonly int _leads;
    private readonly LeadSetConditioner _conditioner;
    private readonly QrsDetector _detector;
    private readonly SignalRing _ring;
    private readonly int _pre;
    private readonly int _post;
    private readonly List<long> _detections = new();
    private readonly Queue<long> _waiting = new();
    private readonly Queue<BeatClass> _waitingClasses = new();
    private readonly List<Beat> _beats = new();
    private readonly BeatFinisher _finisher;
    private readonly BeatFinishingThread? _thread;
    private readonly Action<Beat> _takeDecided;
    private readonly SignalQualityMonitor _quality;
    private readonly Queue<Beat> _awaitingQuality = new();
    private long _droppedUnanalysable;
    private readonly int _step;
    private long _samples;
    private long _previousFiducial = -1;
    private readonly float[] _work;
    private readonly float[] _rawWork;
    private readonly float[] _window;

    private readonly IReadOnlyList<long>? _given;
    private readonly IReadOnlyList<BeatClass>? _givenClasses;
    private int _nextGiven;

    /// <param name="givenBeats">
    /// Beat positions from an annotation file to use instead of detection (re-analysis), in increasing order; null
    /// detects. Delineation and classification still run on the signal.
    /// </param>
    /// <param name="givenClasses">The annotation file's reviewed classes for <paramref name="givenBeats"/>, kept as they are; null classifies.</param>
    /// <param name="quality">Signal-quality settings, with the leads' saturation rails when the format knows them.</param>
    /// <param name="finishOnSecondThread">
    /// Delineate and classify on a thread of its own, overlapping conditioning, quality and detection (for one
    /// recording on a machine with a core to spare). The beats are the same either way.
    /// </param>
    public BeatAnalyser(double samplingRateHz, int leads, IReadOnlyList<long>? givenBeats = null, IReadOnlyList<BeatClass>? givenClasses = null, QualitySettings? quality = null, bool finishOnSecondThread = false)
    {
        _quality = new SignalQualityMonitor(samplingRateHz, leads, quality);
        _given = givenBeats;
        _givenClasses = givenClasses;
        _fs = samplingRateHz;
        _leads = leads;
        _conditioner = new LeadSetConditioner(samplingRateHz, leads);

        _detector = new QrsDetector(samplingRateHz, leads);
        _finisher = new BeatFinisher(samplingRateHz, leads, givenBeats is not null, Timings);
        _takeDecided = _awaitingQuality.Enqueue;
        _pre = (int)Math.Round(BeatWindow.PreS * samplingRateHz);
        _post = (int)Math.Round(BeatWindow.PostS * samplingRateHz);
        _ring = new SignalRing(leads, (int)Math.Ceiling(BeatWindow.RingS * samplingRateHz));
        _window = new float[leads * (_pre + _post + 1)];
        _step = Math.Max(1, (int)Math.Round(samplingRateHz));
        _work = new float[leads * _step];
        _rawWork = new float[leads * _step];
        if (finishOnSecondThread)
        {
            _thread = new BeatFinishingThread(_finisher, _window.Length);
            Timings.TwoThreads = true;
        }
    }

    /// <summary>Beats decided so far, in time order; only beats in analysable signal.</summary>
    public IReadOnlyList<Beat> Beats => _beats;

    /// <summary>Analysable and unanalysable stretches of the signal (rows of <c>quality.csv</c>), decided so far.</summary>
    public IReadOnlyList<QualityStretch> Quality => _quality.Stretches;

    /// <summary>Time spent in each stage so far (for <c>--timings</c> and the benchmarks).</summary>
    public BeatStageTimings Timings { get; } = new();

    /// <summary>Beats detected (or given) inside unanalysable stretches and therefore not emitted.</summary>
    public long DroppedUnanalysable => _droppedUnanalysable;

    public double SamplingRateHz => _fs;

    /// <summary>The second thread, when there is one (for tests).</summary>
    internal BeatFinishingThread? SecondThread => _thread;

    /// <summary>Feeds <paramref name="count"/> samples of every lead, lead-major (lead k at k × count), in mV.</summary>
    public void Process(ReadOnlySpan<float> raw, int count)
    {
        // In steps of one second aligned to the recording's start, so that every beat's window is taken before the
        // ring overwrites it and every decision happens at the same sample whatever the caller's block size.
        for (var done = 0; done < count;)
        {
            var step = (int)Math.Min(_step - (_samples % _step), count - done);
            ProcessStep(raw, count, done, step);
            done += step;
            _samples += step;
        }
    }

    private void ProcessStep(ReadOnlySpan<float> raw, int stride, int offset, int count)
    {
        var rawStep = _rawWork.AsSpan(0, _leads * count);
        var conditioned = _work.AsSpan(0, _leads * count);
        for (var k = 0; k < _leads; k++)
        {
            raw.Slice(k * stride + offset, count).CopyTo(rawStep.Slice(k * count, count));
        }

        var t0 = Stopwatch.GetTimestamp();
        rawStep.CopyTo(conditioned);
        _conditioner.Process(conditioned, count);

        var t1 = Stopwatch.GetTimestamp();
        _quality.Process(rawStep, conditioned, count);
        var t2 = Stopwatch.GetTimestamp();
        Timings.Conditioning += t1 - t0;
        Timings.Quality += t2 - t1;
        _ring.Append(conditioned, count);
        if (_given is null)
        {
            _detector.Process(conditioned, count);
            Timings.Detection += Stopwatch.GetTimestamp() - t2;
            _detector.TakeDetections(_detections);
            foreach (var d in _detections)
            {
                _waiting.Enqueue(d);
            }

            _detections.Clear();
        }
        else
        {
            while (_nextGiven < _given.Count && _given[_nextGiven] < _ring.End)
            {
                if (_givenClasses is not null)
                {
                    _waitingClasses.Enqueue(_givenClasses[_nextGiven]);
                }

                _waiting.Enqueue(_given[_nextGiven++]);
            }
        }

        // Beats are taken only at whole steps of the recording, never at the caller's block boundaries, so what each
        // beat's delineation can see of its neighbours never depends on the block size.
        if ((_samples + count) % _step == 0)
        {
            DrainReady(final: false);
        }
    }

    /// <summary>Ends the stream: every remaining beat is decided.</summary>
    public void Complete()
    {
        if (_given is not null)
        {
            // Given beats past the end of the signal are dropped: there is nothing to delineate them on.
            _nextGiven = _given.Count;
        }

        _detector.Flush();
        _detector.TakeDetections(_detections);
        foreach (var d in _detections)
        {
            _waiting.Enqueue(d);
        }

        _detections.Clear();
        DrainReady(final: true);
        if (_thread is null)
        {
            _finisher.Flush(_takeDecided);
        }
        else
        {
            _thread.Complete(_awaitingQuality);
        }

        _quality.Flush();
        ReleaseJudged(final: true);
    }

    private void DrainReady(bool final)
    {
        while (_waiting.Count > 0 && (final || _waiting.Peek() + _post < _ring.End))
        {
            var fiducial = _waiting.Dequeue();
            var window = _thread is null ? _window : _thread.NextWindow();
            var (first, length) = _ring.CopyWindow(fiducial - _pre, _pre + _post + 1, window);
            int? previous = _previousFiducial >= first ? (int)(_previousFiducial - first) : null;
            int? next = _waiting.Count > 0 && _waiting.Peek() < first + length ? (int)(_waiting.Peek() - first) : null;
            BeatClass? given = _givenClasses is not null ? _waitingClasses.Dequeue() : null;
            var job = new BeatJob(first, length, (int)(fiducial - first), previous, next, given);
            _previousFiducial = fiducial;
            if (_thread is null)
            {
                _finisher.Finish(job, window, _takeDecided);
            }
            else
            {
                _thread.Submit(job);
            }
        }

        _thread?.TakeDone(_awaitingQuality);
        ReleaseJudged(final: false);
    }

    /// <summary>Stops the second thread, if there is one, when the stream is abandoned before <see cref="Complete"/>.</summary>
    public void Dispose() => _thread?.Dispose();

    // A beat is kept once the quality of its second is decided, and only if that second is analysable:
    // every row of beats.csv is a detection in signal that could be read.
    private void ReleaseJudged(bool final)
    {
        while (_awaitingQuality.Count > 0 && (final || _awaitingQuality.Peek().Sample < _quality.DecidedUntilSample))
        {
            var beat = _awaitingQuality.Dequeue();
            if (!_quality.IsAnalysableAt(beat.Sample))
            {
                _droppedUnanalysable++;
                continue;
            }

            beat.LeadQuality = _quality.BeatLeadQuality(beat.Sample);
            _beats.Add(beat);
        }
    }
}
