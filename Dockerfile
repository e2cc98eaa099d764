# syntax=docker/dockerfile:1

# Build stage: restore first from the project files alone, so that layer is reused while only sources change; then
# build and publish the service framework-dependent. The tests run in CI (.ci/run), not here.
FROM mcr.microsoft.com/dotnet/sdk:10.0 AS build
WORKDIR /src
COPY global.json Directory.Build.props Directory.Packages.props .editorconfig ./
COPY src/Directory.Build.props src/
COPY src/SafetyMirror.Core/SafetyMirror.Core.csproj src/SafetyMirror.Core/
COPY src/SafetyMirror.Reports/SafetyMirror.Reports.csproj src/SafetyMirror.Reports/
COPY src/SafetyMirror.Studies/SafetyMirror.Studies.csproj src/SafetyMirror.Studies/
COPY src/SafetyMirror.Api/SafetyMirror.Api.csproj src/SafetyMirror.Api/
RUN dotnet restore src/SafetyMirror.Api/SafetyMirror.Api.csproj
COPY src/ src/
# The demo corners are embedded in the service as OpenAPI examples.
COPY openapi/examples/ openapi/examples/
RUN dotnet build src/SafetyMirror.Api/SafetyMirror.Api.csproj --configuration Release --no-restore
RUN dotnet publish src/SafetyMirror.Api/SafetyMirror.Api.csproj --configuration Release --no-build --output /app \
        -p:UseAppHost=false

# Run stage: the ASP.NET Core runtime only, as the image's unprivileged "app" user.
FROM mcr.microsoft.com/dotnet/aspnet:10.0 AS run
WORKDIR /app
COPY --from=build /app ./
# The one folder the service writes (the SQLite study file and the API-key store by default); mount a volume here.
RUN mkdir data && chown "$APP_UID" data
# URLS rather than ASPNETCORE_URLS: appsettings.json's "Urls" (localhost only) outranks ASPNETCORE_-prefixed
# variables, while unprefixed environment variables outrank appsettings.json.
ENV URLS=http://+:5180
EXPOSE 5180
USER $APP_UID
# The runtime image has no curl or wget: the service's own executable asks its liveness probe (exit 0 or 1).
HEALTHCHECK --interval=30s --timeout=5s --start-period=30s --retries=3 \
    CMD ["dotnet", "SafetyMirror.Api.dll", "probe"]
ENTRYPOINT ["dotnet", "SafetyMirror.Api.dll"]
