using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Authorization;
using Microsoft.OpenApi;
using Swashbuckle.AspNetCore.SwaggerGen;

namespace SafetyMirror.Api.Access;

/// <summary>Registers API-key authentication, the key store and the policy that write and costly routes carry.</summary>
public static class AccessSetup
{
    /// <summary>The authorization policy of routes that write or cost: an API key, or a local caller where allowed.</summary>
    public const string KeyPolicy = "api-key";

    /// <summary>Binds <see cref="AccessOptions"/>, adds the SQLite key store, the API-key scheme and its policy, and documents the scheme.</summary>
    public static WebApplicationBuilder AddAccess(this WebApplicationBuilder builder)
    {
        var access = builder.Configuration.GetSection(AccessOptions.Section).Get<AccessOptions>() ?? new AccessOptions();
        builder.Services.AddSingleton(access);
        builder.Services.AddSingleton<IApiKeyStore>(new SqliteApiKeyStore(KeyStorePath(access, builder.Environment)));

        builder.Services.AddAuthentication(ApiKeyAuthenticationHandler.SchemeName)
            .AddScheme<AuthenticationSchemeOptions, ApiKeyAuthenticationHandler>(ApiKeyAuthenticationHandler.SchemeName, null);
        builder.Services.AddAuthorizationBuilder()
            .AddPolicy(KeyPolicy, policy => policy.AddAuthenticationSchemes(ApiKeyAuthenticationHandler.SchemeName).RequireClaim(AccessClaims.Owner));

        builder.Services.ConfigureSwaggerGen(options =>
        {
            options.AddSecurityDefinition(ApiKeyAuthenticationHandler.SchemeName, new OpenApiSecurityScheme
            {
                Type = SecuritySchemeType.ApiKey,
                In = ParameterLocation.Header,
                Name = ApiKeyAuthenticationHandler.Header,
                Description = $"An API key issued by the service's operator, in the {ApiKeyAuthenticationHandler.Header} header "
                    + $"(or as 'Authorization: {ApiKeyAuthenticationHandler.SchemeName} <key>'). Without one, or with a wrong one, the answer is 401.",
            });
            options.OperationFilter<KeyRequirementFilter>();
        });
        return builder;
    }

    /// <summary>The key store's file: the configured path, from the content root when relative.</summary>
    public static string KeyStorePath(AccessOptions access, IHostEnvironment environment) =>
        Path.GetFullPath(access.KeyStorePath, environment.ContentRootPath);

    /// <summary>Requires an API key (or a local caller where allowed) on a route or group, and documents its 401 and 403.</summary>
    public static TBuilder RequireApiKey<TBuilder>(this TBuilder builder)
        where TBuilder : IEndpointConventionBuilder =>
        builder.RequireAuthorization(KeyPolicy)
            .ProducesProblem(StatusCodes.Status401Unauthorized)
            .ProducesProblem(StatusCodes.Status403Forbidden);

    /// <summary>Puts the API-key requirement on the operations whose routes require a key.</summary>
    private sealed class KeyRequirementFilter : IOperationFilter
    {
        public void Apply(OpenApiOperation operation, OperationFilterContext context)
        {
            var metadata = context.ApiDescription.ActionDescriptor.EndpointMetadata;
            if (!metadata.OfType<IAuthorizeData>().Any() || metadata.OfType<IAllowAnonymous>().Any())
            {
                return;
            }

            operation.Security ??= [];
            operation.Security.Add(new OpenApiSecurityRequirement
            {
                [new OpenApiSecuritySchemeReference(ApiKeyAuthenticationHandler.SchemeName, context.Document)] = [],
            });
        }
    }
}
