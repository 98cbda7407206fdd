using LongRecord.Reporting.Drawing;
using LongRecord.Reporting.Model;
using LongRecord.Reporting.Strips;
using LongRecord.Reporting.Templates;
using SkiaSharp;

namespace LongRecord.Reporting.Pages;

/// <summary>What every page needs while the report is drawn.</summary>
public sealed class ReportContext(ReportModel model, ReportTemplate template, IStripSource? strips, Painter painter, StripRenderer renderer)
{
    /// <summary>Page margin, mm.</summary>
    public const float MarginMm = 12;

    /// <summary>Top of the page body below the running header, mm.</summary>
    public const float BodyTopMm = 22;

    /// <summary>Bottom of the page body above the footer, mm.</summary>
    public float BodyBottomMm => (float)Template.Paper.HeightMm - 14;

    public ReportModel Model { get; } = model;

    public ReportTemplate Template { get; } = template;

    /// <summary>Signal for strips; null when the beats came without a signal.</summary>
    public IStripSource? Strips { get; } = strips;

    public Painter P { get; } = painter;

    public StripRenderer Renderer { get; } = renderer;

    public float PageWidthMm => (float)Template.Paper.WidthMm;

    public float BodyWidthMm => PageWidthMm - 2 * MarginMm;

    public SKRect Body => new(MarginMm, BodyTopMm, PageWidthMm - MarginMm, BodyBottomMm);

    public string Moment(double s, bool seconds = true) => ReportText.Moment(Model.Recording.Start, s, seconds);
}
