using System.Collections.Immutable;
using System.Diagnostics.CodeAnalysis;

namespace SafetyMirror.Core.Site;

/// <summary>What reading a plan gave: the plan, or every problem found in it.</summary>
public sealed record SitePlanReadResult
{
    private SitePlanReadResult(SitePlan? plan, ImmutableArray<SitePlanProblem> problems)
    {
        Plan = plan;
        Problems = problems;
    }

    /// <summary>The plan in local metres; null when there are problems.</summary>
    public SitePlan? Plan { get; }

    /// <summary>Every problem found; empty when the plan was read.</summary>
    public ImmutableArray<SitePlanProblem> Problems { get; }

    /// <summary>True when the plan was read without problems.</summary>
    [MemberNotNullWhen(true, nameof(Plan))]
    public bool Succeeded => Plan is not null;

    internal static SitePlanReadResult Success(SitePlan plan) => new(plan, []);

    internal static SitePlanReadResult Failure(IEnumerable<SitePlanProblem> problems) => new(null, [.. problems]);
}
