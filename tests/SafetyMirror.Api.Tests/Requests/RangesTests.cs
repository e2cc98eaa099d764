using System.ComponentModel;
using System.ComponentModel.DataAnnotations;
using System.Globalization;
using System.Reflection;
using SafetyMirror.Api.Requests;

namespace SafetyMirror.Api.Tests.Requests;

public sealed class RangesTests
{
    private static readonly IEnumerable<PropertyInfo> ContractMembers = typeof(Ranges).Assembly.GetTypes()
        .Where(RequestChecks.IsContract)
        .SelectMany(type => type.GetProperties(BindingFlags.Public | BindingFlags.Instance | BindingFlags.DeclaredOnly));

    [Fact]
    public void Descriptions_StateTheRangeTheContractEnforces()
    {
        var disagreeing = ContractMembers
            .Where(member => member.GetCustomAttribute<RangeAttribute>() is not null && member.GetCustomAttribute<DescriptionAttribute>() is not null)
            .Where(member =>
            {
                var range = member.GetCustomAttribute<RangeAttribute>()!;
                var said = member.GetCustomAttribute<DescriptionAttribute>()!.Description.Replace('−', '-');
                return !said.Contains(string.Create(CultureInfo.InvariantCulture, $"{range.Minimum} to {range.Maximum}"), StringComparison.Ordinal);
            })
            .Select(member => $"{member.DeclaringType!.Name}.{member.Name}");

        Assert.Empty(disagreeing);
    }

    [Fact]
    public void Descriptions_StateTheLengthTheContractEnforces()
    {
        var disagreeing = ContractMembers
            .Where(member => member.PropertyType == typeof(string) && member.GetCustomAttribute<MaxLengthAttribute>() is { Length: > Ranges.MaxIdLength })
            .Where(member => member.GetCustomAttribute<DescriptionAttribute>() is not { } description
                || !description.Description.Contains($"at most {member.GetCustomAttribute<MaxLengthAttribute>()!.Length} characters", StringComparison.Ordinal))
            .Select(member => $"{member.DeclaringType!.Name}.{member.Name}");

        Assert.Empty(disagreeing);
    }
}
