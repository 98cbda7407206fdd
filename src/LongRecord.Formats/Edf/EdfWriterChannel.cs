namespace LongRecord.Formats.Edf;

/// <summary>One ordinary signal of a file written by <see cref="EdfWriter"/> (EDF spec, per-signal header fields).</summary>
public sealed record EdfWriterChannel
{
    /// <summary>Label, at most 16 ASCII characters (EDF+ 2.1.3.1 suggests "ECG V2" style: type, space, sensor).</summary>
    public required string Label { get; init; }

    /// <summary>Transducer type, at most 80 ASCII characters.</summary>
    public string Transducer { get; init; } = "";

    /// <summary>Physical dimension, at most 8 ASCII characters; <see cref="EdfWriter"/> takes samples in mV for voltage units.</summary>
    public string PhysicalUnit { get; init; } = "mV";

    /// <summary>Physical value of <see cref="DigitalMin"/>; written in at most 8 characters (rounded to fit).</summary>
    public required double PhysicalMin { get; init; }

    /// <summary>Physical value of <see cref="DigitalMax"/>; written in at most 8 characters (rounded to fit).</summary>
    public required double PhysicalMax { get; init; }

    /// <summary>Smallest digital value; default −32768 (EDF) or −8388608 (BDF).</summary>
    public int? DigitalMin { get; init; }

    /// <summary>Largest digital value; default 32767 (EDF) or 8388607 (BDF).</summary>
    public int? DigitalMax { get; init; }

    /// <summary>Pre-filtering, at most 80 ASCII characters (EDF+ style "HP:0.05Hz LP:40Hz").</summary>
    public string Prefilter { get; init; } = "";

    /// <summary>Samples of this channel in each data record; rate = SamplesPerRecord ÷ record duration.</summary>
    public required int SamplesPerRecord { get; init; }
}
