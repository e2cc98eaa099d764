# syntax=docker/dockerfile:1

# Build stage: the same test run as CI, then a framework-dependent publish of the service.
FROM mcr.microsoft.com/dotnet/sdk:10.0 AS build
WORKDIR /src
COPY . .
RUN bash .ci/run
RUN dotnet publish src/SafetyMirror.Api/SafetyMirror.Api.csproj --configuration Release --no-restore \
        --output /app -p:UseAppHost=false

# Run stage: the ASP.NET Core runtime only, as the image's unprivileged "app" user.
FROM mcr.microsoft.com/dotnet/aspnet:10.0 AS run
WORKDIR /app
COPY --from=build /app ./
# URLS rather than ASPNETCORE_URLS: appsettings.json's "Urls" (localhost only) outranks ASPNETCORE_-prefixed
# variables, while unprefixed environment variables outrank appsettings.json.
ENV URLS=http://+:5180
EXPOSE 5180
USER $APP_UID
ENTRYPOINT ["dotnet", "SafetyMirror.Api.dll"]
