using System.Collections;
using System.ComponentModel.DataAnnotations;
using System.Reflection;
using System.Text.Json;
using SafetyMirror.Api.Requests;

namespace SafetyMirror.Api.Requests;

/// <summary>Holds every text and list of a request to the <c>[MaxLength]</c> and <c>[MinLength]</c> its contract states.</summary>
/// <remarks>
/// Runs before the readers, so that no reader spends work on, or echoes in a message, a text or list longer than the
/// contract allows. The same attributes give the OpenAPI document its maxLength and maxItems.
/// </remarks>
public static class RequestChecks
{
    /// <summary>Records a problem for each text or list of <paramref name="contract"/> outside its stated length, under its path.</summary>
    public static void Check(object contract, string path, RequestErrors errors)
    {
        ArgumentNullException.ThrowIfNull(contract);
        ArgumentNullException.ThrowIfNull(errors);
        foreach (var member in contract.GetType().GetProperties(BindingFlags.Public | BindingFlags.Instance))
        {
            var value = member.GetValue(contract);
            var at = Join(path, JsonNamingPolicy.CamelCase.ConvertName(member.Name));
            switch (value)
            {
                case string text:
                    CheckLength(member, text.Length, "characters", at, errors);
                    break;
                case IList list:
                    CheckLength(member, list.Count, "items", at, errors);
                    for (var i = 0; i < list.Count; i++)
                    {
                        if (list[i] is { } item && IsContract(item.GetType()))
                        {
                            Check(item, $"{at}[{i}]", errors);
                        }
                    }

                    break;
                case { } nested when IsContract(nested.GetType()):
                    Check(nested, at, errors);
                    break;
            }
        }
    }

    /// <summary>True for the service's own request records, whose members are checked.</summary>
    public static bool IsContract(Type type) => type.Namespace?.StartsWith("SafetyMirror.Api.Features", StringComparison.Ordinal) == true && type.IsClass;

    /// <summary>Checks the request contracts among an endpoint's arguments before it runs; answers 400 when any is too long.</summary>
    public static TBuilder WithRequestChecks<TBuilder>(this TBuilder builder)
        where TBuilder : IEndpointConventionBuilder =>
        builder.AddEndpointFilter(async (context, next) =>
        {
            var errors = new RequestErrors();
            foreach (var argument in context.Arguments.OfType<object>().Where(a => IsContract(a.GetType())))
            {
                Check(argument, "", errors);
            }

            return errors.IsEmpty ? await next(context) : errors.ToValidationProblem("The request holds a text or list longer than this service accepts.");
        });

    private static void CheckLength(PropertyInfo member, int length, string unit, string at, RequestErrors errors)
    {
        if (member.GetCustomAttribute<MaxLengthAttribute>() is { } max && length > max.Length)
        {
            errors.Add(at, $"At most {max.Length} {unit}; it has {length}.");
        }
        else if (member.GetCustomAttribute<MinLengthAttribute>() is { } min && length < min.Length)
        {
            errors.Add(at, $"At least {min.Length} {unit}; it has {length}.");
        }
    }

    private static string Join(string path, string name) => path.Length == 0 ? name : $"{path}.{name}";
}
