using SafetyMirror.Reports.Documents;

namespace SafetyMirror.Reports.Tests.Documents;

/// <summary>The same invented report content, written once for both writers.</summary>
internal static class Report
{
    /// <summary>Two sections: text, a list, a figure and a table; <paramref name="subheading"/> is the first level-2 heading.</summary>
    public static void WriteSample(IReportWriter writer, string subheading)
    {
        writer.Heading("Invented Quince Row driveway", 1);
        writer.Heading(subheading, 2);
        writer.Paragraph("Invented sample text. A convex mirror makes vehicles look farther away and slower than they are.");
        writer.BulletList(["It does not replace removing the obstruction.", "Keep it clean; check for glare and ice."]);
        writer.Figure(Samples.EveryShape(), "Figure 1. An invented sample drawing.");
        writer.Heading("Road users", 1);
        writer.Table(new ReportTable(
            ["Road user", "Height (m)", "Remarks"],
            [["Passenger car", "1.60", "Invented value"], ["Cyclist", "0.60", "Invented value with a long remark that has to wrap within its column of the table."]],
            [2, 1, 5]));
    }
}
