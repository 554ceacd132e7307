'use strict';

// Numbers the runs already stored, per project, in the order they were created.
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.query(
      `UPDATE SimulationRuns r
         JOIN (SELECT id, ROW_NUMBER() OVER (PARTITION BY projectId ORDER BY id) AS n FROM SimulationRuns) o
           ON o.id = r.id
         SET r.number = o.n
       WHERE r.number IS NULL`,
    );
  },
  async down() {
    // The column itself goes with the previous migration's down.
  },
};
