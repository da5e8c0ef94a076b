import type { AnalysisStep } from '../pipeline/types';
import { clusterUnits } from './cluster-units';

/**
 * Pipeline step "cluster": columns cluster (1-based, empty when not
 * clustered), cluster_pc1, cluster_pc2, cluster_silhouette; the session
 * summary holds k, the silhouette per k, explained variance, the feature
 * segments and the class-average z-scored responses for the renderer.
 */
export const clusterStep: AnalysisStep = {
  name: 'cluster',
  selfContained: true,
  run({ recording, parameters }) {
    const c = clusterUnits(recording, parameters);
    return {
      columns: [
        { name: 'cluster', kind: 'number', values: c.cluster, description: 'Response cluster (k-means on PCA of z-scored trial-averaged responses)' },
        { name: 'cluster_pc1', kind: 'number', values: c.pc1, digits: 4, description: 'Score on the first principal component' },
        { name: 'cluster_pc2', kind: 'number', values: c.pc2, digits: 4, description: 'Score on the second principal component' },
        { name: 'cluster_silhouette', kind: 'number', values: c.silhouette, digits: 4, description: 'Silhouette width of the unit in its cluster' },
      ],
      summary: {
        k: c.k,
        structure: c.structure,
        note: c.note,
        unitsUsed: c.unitsUsed,
        silhouetteByK: c.silhouetteByK,
        explainedVariance: c.explainedVariance,
        segments: c.segments,
        classes: c.classes,
        parameters: parameters.cluster,
      },
    };
  },
};
