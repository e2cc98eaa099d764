using SafetyMirror.Core.Design.Glare;

namespace SafetyMirror.Core.Design.Evaluation;

/// <summary>A limit on the year's sun glare, checked like a siting rule: exceeding it puts the mirror outside the rules.</summary>
public static class GlareLimit
{
    /// <summary>The check's stable code.</summary>
    public const string Code = "glare-hours-per-year";

    /// <summary>The evaluation with the glare check added and its verdict judged again; unchanged when the scan was not made.</summary>
    /// <remarks>The value is the worst eye's hours a year of either kind (reflected sun plus sun behind the mirror).</remarks>
    public static MirrorEvaluation WithGlareLimit(this MirrorEvaluation evaluation, GlareScan scan, double hoursPerYearAllowed)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        ArgumentNullException.ThrowIfNull(scan);
        if (!scan.IsComputed)
        {
            return evaluation;
        }

        var hours = scan.Eyes.Select(eye => eye.HoursPerYear).DefaultIfEmpty(0).Max();
        var check = new RuleCheck(Code, "Hours a year the low sun dazzles the waiting driver by way of the mirror", Math.Round(hours, 1),
            hoursPerYearAllowed, "h", "at-most", hours <= hoursPerYearAllowed + 1e-9, "set in the request");
        var checks = (IReadOnlyList<RuleCheck>)[.. evaluation.Checks, check];
        var verdict = EvaluationWording.Verdict(evaluation.Placement, evaluation.Approaches, checks, evaluation.Robustness, evaluation.Options);
        return evaluation with { Checks = checks, Verdict = verdict };
    }
}
