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
public sealed class BeatAnalyser
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
    private long _lastSample = -1;
    private readonly List<Beat> _beats = new();
    private readonly BeatClassifier _classifier;
    private readonly BeatDelineator _delineator;
    private readonly Queue<Beat> _undecided = new();
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
    public BeatAnalyser(double samplingRateHz, int leads, IReadOnlyList<long>? givenBeats = null, IReadOnlyList<BeatClass>? givenClasses = null, QualitySettings? quality = null)
    {
        _quality = new SignalQualityMonitor(samplingRateHz, leads, quality);
        _given = givenBeats;
        _givenClasses = givenClasses;
        _fs = samplingRateHz;
        _leads = leads;
        _conditioner = new LeadSetConditioner(samplingRateHz, leads);

        _detector = new QrsDetector(samplingRateHz, leads);
        _classifier = new BeatClassifier(samplingRateHz, leads);
        _delineator = new BeatDelineator(samplingRateHz, leads);
        _pre = (int)Math.Round(BeatWindow.PreS * samplingRateHz);
        _post = (int)Math.Round(BeatWindow.PostS * samplingRateHz);
        _ring = new SignalRing(leads, (int)Math.Ceiling(BeatWindow.RingS * samplingRateHz));
        _window = new float[leads * (_pre + _post + 1)];
        _step = Math.Max(1, (int)Math.Round(samplingRateHz));
        _work = new float[leads * _step];
        _rawWork = new float[leads * _step];
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
        _classifier.Flush();
        TakeClassified();
        _quality.Flush();
        ReleaseJudged(final: true);
    }

    private void DrainReady(bool final)
    {
        while (_waiting.Count > 0 && (final || _waiting.Peek() + _post < _ring.End))
        {
            var fiducial = _waiting.Dequeue();
            var (first, length) = _ring.CopyWindow(fiducial - _pre, _pre + _post + 1, _window);
            var window = _window.AsSpan(0, _leads * length);
            var at = (int)(fiducial - first);
            int? previous = _previousFiducial >= first ? (int)(_previousFiducial - first) : null;
            int? next = _waiting.Count > 0 && _waiting.Peek() < first + length ? (int)(_waiting.Peek() - first) : null;
            var t0 = Stopwatch.GetTimestamp();
            var d = _delineator.Delineate(window, length, at, new DelineationContext(previous, next, 0));
            var t1 = Stopwatch.GetTimestamp();
            Timings.Delineation += t1 - t0;
            _previousFiducial = fiducial;

            // The beat's point in time is the dominant deflection of its QRS where delineation found one (given beats
            // keep the time the annotation file gives).
            var r = d.RPeak >= 0 && _given is null && first + d.RPeak > _lastSample ? d.RPeak : at;
            if (first + r <= _lastSample)
            {
                // Two detections that delineation places on one complex: the second is not a beat.
                if (_givenClasses is not null)
                {
                    _waitingClasses.Dequeue();
                }

                continue;
            }

            _lastSample = first + r;
            var beat = new Beat
            {
                Sample = first + r,
                QrsOnOffset = Offset(d.QrsOnset, r),
                QrsOffOffset = Offset(d.QrsOffset, r),
                PPeakOffset = Offset(d.PPeak, r),
                TEndOffset = Offset(d.TEnd, r),
                QrsMs = d.HasQrsBounds ? d.QrsMs : float.NaN,
                Template = -1,
                Class = BeatClass.Q,
                PWave = d.PWave,
                LeadQuality = LeadQuality.Good,
                Flags = _given is null ? BeatFlags.None : BeatFlags.FromAnnotation,
            };
            if (_givenClasses is not null)
            {
                // Reviewed labels are kept; the classifier still sees the beat for its templates and rhythm.
                beat.Class = _waitingClasses.Dequeue();
                beat.Flags |= BeatFlags.Labelled;
            }

            _classifier.Add(beat.Sample, window, length, r, new BeatMeasurements(beat.QrsMs, beat.PWave));
            Timings.Classification += Stopwatch.GetTimestamp() - t1;
            _undecided.Enqueue(beat);
            TakeClassified();
        }
    }

    private static short Offset(int index, int reference) => index < 0 ? Beat.Unknown : (short)Math.Clamp(index - reference, short.MinValue + 1, short.MaxValue);

    // The classifier decides a beat once the next one is known; pair its answers with the beats waiting for them.
    private void TakeClassified()
    {
        while (_classifier.TryTake(out var c))
        {
            var beat = _undecided.Dequeue();
            if (beat.Sample != c.Sample)
            {
                throw new InvalidOperationException($"classifier answered for sample {c.Sample}, expected {beat.Sample}");
            }

            if ((beat.Flags & BeatFlags.Labelled) == 0)
            {
                beat.Class = c.Class;
                beat.Flags |= c.Flags;
            }

            beat.Template = c.Template;

            _awaitingQuality.Enqueue(beat);
        }

        ReleaseJudged(final: false);
    }

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
