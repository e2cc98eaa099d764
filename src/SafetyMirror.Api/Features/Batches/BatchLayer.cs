using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using Microsoft.Data.Sqlite;
using NetTopologySuite.Features;
using NetTopologySuite.Geometries;
using NetTopologySuite.IO;
using SafetyMirror.Api.Features.Evaluations;
using SafetyMirror.Core.Design;
using SafetyMirror.Studies;

namespace SafetyMirror.Api.Features.Batches;

/// <summary>A batch's results as one GIS layer: a point per corner with its decision and figures, as GeoJSON or GeoPackage.</summary>
public static class BatchLayer
{
    /// <summary>The layer's name, in the GeoPackage its table's.</summary>
    public const string Name = "corners";

    /// <summary>One sentence every corner of the layer carries, so that no map of the district stands without it.</summary>
    public const string Caution =
        "Screening only: a convex mirror makes vehicles look smaller, farther away and slower, and never replaces removing the obstruction; "
        + "each corner's study holds its full answer and cautions, and local road-authority rules and licensed engineering judgement govern.";

    /// <summary>The cautions that go with any screening: the service's, for its default siting values and road users.</summary>
    public static IReadOnlyList<CautionResponse> Cautions { get; } =
    [
        new("screening-only", Caution),
        .. Core.Design.Cautions.For(SitingRules.Default, RoadUsers.Defaults).Select(c => new CautionResponse(c.Code, c.Text)),
    ];

    // The attribute columns, in order, with their GeoPackage types.
    private static readonly (string Column, string Type)[] Columns =
    [
        ("corner", "TEXT"), ("name", "TEXT"), ("status", "TEXT"), ("kind", "TEXT"), ("decision", "TEXT"),
        ("critical_approach", "TEXT"), ("required_m", "DOUBLE"), ("direct_m", "DOUBLE"), ("mirror_m", "DOUBLE"), ("unseen_m", "DOUBLE"),
        ("mirrors", "INTEGER"), ("pole_x", "DOUBLE"), ("pole_y", "DOUBLE"), ("diameter_m", "DOUBLE"), ("radius_m", "DOUBLE"),
        ("centre_height_m", "DOUBLE"), ("azimuth_deg", "DOUBLE"), ("tilt_down_deg", "DOUBLE"), ("study", "TEXT"), ("problem", "TEXT"),
        ("caution", "TEXT"),
    ];

    /// <summary>The layer's features: a point at each corner's eye (none when the corner was not screened) with its attributes.</summary>
    public static IReadOnlyList<IFeature> Features(BatchRecord batch, IReadOnlyList<BatchCorner> corners, JsonSerializerOptions json)
    {
        ArgumentNullException.ThrowIfNull(corners);
        return [.. corners.Select(corner =>
        {
            var outcome = corner.OutcomeJson is null ? null : JsonSerializer.Deserialize<CornerOutcome>(corner.OutcomeJson, json);
            var critical = outcome?.Critical;
            var face = outcome?.Mirrors.FirstOrDefault();
            var attributes = new AttributesTable
            {
                { "corner", corner.Corner },
                { "name", corner.Name },
                { "status", corner.Status.ToString().ToLowerInvariant() },
                { "kind", outcome?.Kind },
                { "decision", outcome?.Decision },
                { "critical_approach", critical?.Approach },
                { "required_m", critical?.RequiredM },
                { "direct_m", critical?.DirectM },
                { "mirror_m", critical?.MirrorM },
                { "unseen_m", outcome?.LongestUnseenM },
                { "mirrors", outcome?.Mirrors.Count },
                { "pole_x", face?.Pole.X },
                { "pole_y", face?.Pole.Y },
                { "diameter_m", face?.DiameterM ?? face?.WidthM },
                { "radius_m", face?.RadiusM },
                { "centre_height_m", face?.CentreHeightM },
                { "azimuth_deg", face?.AzimuthDeg },
                { "tilt_down_deg", face?.TiltDownDeg },
                { "study", corner.StudyId is { } study ? $"/v1/studies/{study}" : null },
                { "problem", Problem(corner.ProblemJson) },
                { "caution", Caution },
            };
            return (IFeature)new Feature(outcome?.Location, attributes);
        })];
    }

    /// <summary>The layer as a GeoJSON FeatureCollection with the batch's name, id and cautions beside the features.</summary>
    public static string ToGeoJson(BatchRecord batch, IReadOnlyList<IFeature> features, JsonSerializerOptions json)
    {
        ArgumentNullException.ThrowIfNull(batch);
        var collection = new FeatureCollection();
        foreach (var feature in features)
        {
            collection.Add(feature);
        }

        var layer = JsonSerializer.SerializeToNode(collection, json)!.AsObject();
        layer["name"] = batch.Name;
        layer["batch"] = batch.Id.ToString();
        layer["cautions"] = JsonSerializer.SerializeToNode(Cautions, json);
        return layer.ToJsonString(json);
    }

    /// <summary>The layer as an OGC GeoPackage (version 1.3): one feature table of points, WGS84 when every plan is, else undefined Cartesian.</summary>
    public static byte[] ToGeoPackage(BatchRecord batch, IReadOnlyList<IFeature> features, bool geographic)
    {
        ArgumentNullException.ThrowIfNull(batch);
        ArgumentNullException.ThrowIfNull(features);
        var srs = geographic ? 4326 : -1;
        var file = Path.Combine(Path.GetTempPath(), $"safetymirror-layer-{Guid.NewGuid():N}.gpkg");
        try
        {
            using (var connection = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = file, Pooling = false }.ToString()))
            {
                connection.Open();
                using var transaction = connection.BeginTransaction();
                Execute(connection, transaction, GeoPackageSchema);
                Execute(connection, transaction, $"""
                    CREATE TABLE {Name} (fid INTEGER PRIMARY KEY AUTOINCREMENT, geom POINT,
                        {string.Join(", ", Columns.Select(c => $"{c.Column} {c.Type}"))})
                    """);

                var points = features.Select(f => f.Geometry).OfType<Point>().ToList();
                using (var contents = Command(connection, transaction, """
                    INSERT INTO gpkg_contents (table_name, data_type, identifier, description, last_change, min_x, min_y, max_x, max_y, srs_id)
                    VALUES (@table, 'features', @table, @description, @changed, @min_x, @min_y, @max_x, @max_y, @srs)
                    """))
                {
                    contents.Parameters.AddWithValue("@table", Name);
                    contents.Parameters.AddWithValue("@description", $"{batch.Name}: corners screened for a convex safety mirror. {Caution}");
                    contents.Parameters.AddWithValue("@changed", (batch.LastFinishedAt ?? batch.CreatedAt).UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fff'Z'", CultureInfo.InvariantCulture));
                    contents.Parameters.AddWithValue("@min_x", points.Count == 0 ? DBNull.Value : points.Min(p => p.X));
                    contents.Parameters.AddWithValue("@min_y", points.Count == 0 ? DBNull.Value : points.Min(p => p.Y));
                    contents.Parameters.AddWithValue("@max_x", points.Count == 0 ? DBNull.Value : points.Max(p => p.X));
                    contents.Parameters.AddWithValue("@max_y", points.Count == 0 ? DBNull.Value : points.Max(p => p.Y));
                    contents.Parameters.AddWithValue("@srs", srs);
                    contents.ExecuteNonQuery();
                }

                using (var geometryColumn = Command(connection, transaction,
                    "INSERT INTO gpkg_geometry_columns VALUES (@table, 'geom', 'POINT', @srs, 0, 0)"))
                {
                    geometryColumn.Parameters.AddWithValue("@table", Name);
                    geometryColumn.Parameters.AddWithValue("@srs", srs);
                    geometryColumn.ExecuteNonQuery();
                }

                var writer = new GeoPackageGeoWriter();
                using var insert = Command(connection, transaction, $"""
                    INSERT INTO {Name} (geom, {string.Join(", ", Columns.Select(c => c.Column))})
                    VALUES (@geom, {string.Join(", ", Columns.Select(c => "@" + c.Column))})
                    """);
                foreach (var feature in features)
                {
                    insert.Parameters.Clear();
                    object geometry = DBNull.Value;
                    if (feature.Geometry is Point point)
                    {
                        var located = (Point)point.Copy();
                        located.SRID = srs;
                        geometry = writer.Write(located);
                    }

                    insert.Parameters.AddWithValue("@geom", geometry);
                    foreach (var (column, _) in Columns)
                    {
                        insert.Parameters.AddWithValue("@" + column, feature.Attributes[column] ?? DBNull.Value);
                    }

                    insert.ExecuteNonQuery();
                }

                transaction.Commit();
            }

            return File.ReadAllBytes(file);
        }
        finally
        {
            File.Delete(file);
        }
    }

    /// <summary>Whether every screened corner's plan is in WGS84 longitude and latitude.</summary>
    public static bool AllGeographic(IReadOnlyList<BatchCorner> corners, JsonSerializerOptions json)
    {
        ArgumentNullException.ThrowIfNull(corners);
        var outcomes = corners.Where(c => c.OutcomeJson is not null).Select(c => JsonSerializer.Deserialize<CornerOutcome>(c.OutcomeJson!, json)).ToList();
        return outcomes.Count > 0 && outcomes.All(o => o?.Geographic == true);
    }

    /// <summary>A failed corner's problem in one line: its title and its first named field.</summary>
    private static string? Problem(string? problemJson)
    {
        if (problemJson is null || JsonNode.Parse(problemJson) is not JsonObject problem)
        {
            return null;
        }

        var first = (problem["errors"] as JsonObject)?.FirstOrDefault();
        var message = first is { } error ? $" {error.Key}: {error.Value?.AsArray().FirstOrDefault()}" : "";
        return $"{problem["title"]}{message}";
    }

    private static SqliteCommand Command(SqliteConnection connection, SqliteTransaction transaction, string sql)
    {
        var command = connection.CreateCommand();
        command.Transaction = transaction;
        command.CommandText = sql;
        return command;
    }

    private static void Execute(SqliteConnection connection, SqliteTransaction transaction, string sql)
    {
        using var command = Command(connection, transaction, sql);
        command.ExecuteNonQuery();
    }

    // OGC GeoPackage 1.3 (OGC 12-128r18): the application id "GPKG", the version, the three required tables and SRS rows.
    private const string GeoPackageSchema = """
        PRAGMA application_id = 1196444487;
        PRAGMA user_version = 10300;
        CREATE TABLE gpkg_spatial_ref_sys (
            srs_name TEXT NOT NULL, srs_id INTEGER PRIMARY KEY, organization TEXT NOT NULL,
            organization_coordsys_id INTEGER NOT NULL, definition TEXT NOT NULL, description TEXT);
        INSERT INTO gpkg_spatial_ref_sys VALUES
            ('Undefined Cartesian SRS', -1, 'NONE', -1, 'undefined', 'undefined Cartesian coordinate reference system'),
            ('Undefined geographic SRS', 0, 'NONE', 0, 'undefined', 'undefined geographic coordinate reference system'),
            ('WGS 84 geodetic', 4326, 'EPSG', 4326,
             'GEOGCS["WGS 84",DATUM["WGS_1984",SPHEROID["WGS 84",6378137,298.257223563,AUTHORITY["EPSG","7030"]],AUTHORITY["EPSG","6326"]],PRIMEM["Greenwich",0,AUTHORITY["EPSG","8901"]],UNIT["degree",0.0174532925199433,AUTHORITY["EPSG","9122"]],AXIS["Latitude",NORTH],AXIS["Longitude",EAST],AUTHORITY["EPSG","4326"]]',
             'longitude/latitude coordinates in decimal degrees on the WGS 84 spheroid');
        CREATE TABLE gpkg_contents (
            table_name TEXT NOT NULL PRIMARY KEY, data_type TEXT NOT NULL, identifier TEXT UNIQUE, description TEXT DEFAULT '',
            last_change DATETIME NOT NULL DEFAULT (strftime('%Y-%m-%dT%H:%M:%fZ','now')),
            min_x DOUBLE, min_y DOUBLE, max_x DOUBLE, max_y DOUBLE, srs_id INTEGER,
            CONSTRAINT fk_gc_r_srs_id FOREIGN KEY (srs_id) REFERENCES gpkg_spatial_ref_sys (srs_id));
        CREATE TABLE gpkg_geometry_columns (
            table_name TEXT NOT NULL, column_name TEXT NOT NULL, geometry_type_name TEXT NOT NULL, srs_id INTEGER NOT NULL,
            z TINYINT NOT NULL, m TINYINT NOT NULL,
            CONSTRAINT pk_geom_cols PRIMARY KEY (table_name, column_name),
            CONSTRAINT uk_gc_table_name UNIQUE (table_name),
            CONSTRAINT fk_gc_tn FOREIGN KEY (table_name) REFERENCES gpkg_contents (table_name),
            CONSTRAINT fk_gc_srs FOREIGN KEY (srs_id) REFERENCES gpkg_spatial_ref_sys (srs_id));
        """;
}
